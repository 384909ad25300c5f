import { describe, expect, it } from "vitest";
import { classifyCell, isDecimalComma, looksNumeric, notANumberHint } from "./parse-number.js";

// Spellings as numpy.savetxt, pandas.to_csv, R and MATLAB write them (common practice); each case also pins
// an end of a pattern, so a pattern that lost its anchor or a quantifier fails here.
describe("classifyCell", () => {
  it("reads decimals, with or without digits before the point, with an exponent with or without sign", () => {
    expect(classifyCell("0.25")).toEqual({ kind: "number", value: 0.25 });
    expect(classifyCell(".25")).toEqual({ kind: "number", value: 0.25 });
    expect(classifyCell("-3.")).toEqual({ kind: "number", value: -3 });
    expect(classifyCell("1e5")).toEqual({ kind: "number", value: 100000 });
    expect(classifyCell("2.5E-3")).toEqual({ kind: "number", value: 0.0025 });
    expect(classifyCell("+7")).toEqual({ kind: "number", value: 7 });
    expect(classifyCell("")).toEqual({ kind: "empty" });
    expect(classifyCell("0x1A")).toEqual({ kind: "text" });
    expect(classifyCell("1.5.2")).toEqual({ kind: "text" });
  });

  it("reads NaN, NA and infinities in any case and sign, and nothing that only contains them", () => {
    expect(classifyCell("nan").kind).toBe("not-finite");
    expect(classifyCell("-NaN").kind).toBe("not-finite");
    expect(classifyCell("NA").kind).toBe("not-finite");
    expect(classifyCell("inf")).toEqual({ kind: "not-finite", value: Infinity });
    expect(classifyCell("-Infinity")).toEqual({ kind: "not-finite", value: -Infinity });
    expect(classifyCell("+INF")).toEqual({ kind: "not-finite", value: Infinity });
    for (const text of ["nano", "banana", "xnan", "*nan", "infant", "tinf", "min", "NAN2"])
      expect(classifyCell(text), text).toEqual({ kind: "text" });
    expect(looksNumeric("nan")).toBe(true);
    expect(looksNumeric("1")).toBe(true);
    expect(looksNumeric("node1")).toBe(false);
  });
});

describe("isDecimalComma", () => {
  it("recognises whole decimal-comma numbers only", () => {
    for (const cell of ["0,5", "12,25", "-,25", "+3,125"]) expect(isDecimalComma(cell), cell).toBe(true);
    for (const cell of ["0,5x", "a0,5", "1,", "0.5", "1,2,3"]) expect(isDecimalComma(cell), cell).toBe(false);
  });
});

describe("notANumberHint", () => {
  it("names decimal commas, and spaces inside a tab-separated line, and nothing else", () => {
    expect(notANumberHint("0,5", ",")).toMatch(/decimal commas/);
    expect(notANumberHint("1 2", "\t")).toMatch(/spaces but the file with tabs/);
    expect(notANumberHint("1  2.5", "\t")).toMatch(/spaces but the file with tabs/);
    // Spaces in a comma- or space-separated file are another matter; text between numbers is not a number.
    expect(notANumberHint("1 2", ",")).toBe("");
    expect(notANumberHint("1 x", "\t")).toBe("");
    expect(notANumberHint("node", "\t")).toBe("");
  });
});

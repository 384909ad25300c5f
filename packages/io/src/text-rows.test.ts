import { describe, expect, it } from "vitest";
import type { InputFileError } from "./input-file-error.js";
import { classifyCell } from "./parse-number.js";
import { detectDelimiter, textRows } from "./text-rows.js";

const rows = (text: string, delimiter: Parameters<typeof textRows>[1]) => [
  ...textRows(text, delimiter, "t.csv"),
];

describe("textRows", () => {
  it("keeps line numbers across comments, blank lines and CRLF endings", () => {
    expect(rows("# c\r\n\r\na,b\r\n\r\nc,d", ",")).toEqual([
      { line: 3, cells: ["a", "b"] },
      { line: 5, cells: ["c", "d"] },
    ]);
  });

  it("reads RFC 4180 quoted fields: delimiters, doubled quotes and line breaks inside (RFC 4180 §2.6, §2.7)", () => {
    expect(rows('"a,1","say ""x""","two\nlines"\nnext,row,3\n', ",")).toEqual([
      { line: 1, cells: ["a,1", 'say "x"', "two\nlines"] },
      { line: 3, cells: ["next", "row", "3"] },
    ]);
  });

  it("a line of tabs in a TSV file is a row of empty cells, not a blank line", () => {
    expect(rows("1\t2\t3\n\t\t\n", "\t")).toEqual([
      { line: 1, cells: ["1", "2", "3"] },
      { line: 2, cells: ["", "", ""] },
    ]);
  });

  it("a # inside a quoted first cell is data, not a comment", () => {
    expect(rows('"#1",2\n', ",")).toEqual([{ line: 1, cells: ["#1", "2"] }]);
  });

  it("reports an unclosed quote where the cell starts", () => {
    try {
      rows('a,b\nc,"d\ne\n', ",");
      expect.unreachable();
    } catch (error) {
      expect((error as InputFileError).message).toBe("t.csv:2:2: quoted cell is never closed");
    }
  });

  it("detects the delimiter from the first data line", () => {
    expect(detectDelimiter("# a,b\n1\t2\n")).toBe("\t");
    expect(detectDelimiter("1,2\n")).toBe(",");
    expect(detectDelimiter("1;2\n")).toBe(";");
    expect(detectDelimiter("1 2\n")).toBe("whitespace");
  });
});

describe("classifyCell", () => {
  it("accepts decimal numbers only; Number() would take '' as 0 and '0x1A' as 26", () => {
    expect(classifyCell("")).toEqual({ kind: "empty" });
    expect(classifyCell("0x1A")).toEqual({ kind: "text" });
    expect(classifyCell("1e")).toEqual({ kind: "text" });
    expect(classifyCell("1,5")).toEqual({ kind: "text" });
    expect(classifyCell("-.5e-3")).toEqual({ kind: "number", value: -0.0005 });
    expect(classifyCell("+3.")).toEqual({ kind: "number", value: 3 });
  });

  it("recognises NaN and infinity as numpy, R and JavaScript write them (common practice)", () => {
    for (const t of ["nan", "NaN", "NA"]) expect(classifyCell(t).kind).toBe("not-finite");
    expect(classifyCell("-inf")).toEqual({ kind: "not-finite", value: Number.NEGATIVE_INFINITY });
    expect(classifyCell("Infinity")).toEqual({ kind: "not-finite", value: Number.POSITIVE_INFINITY });
    expect(classifyCell("na")).toEqual({ kind: "text" });
  });
});

import { describe, expect, it } from "vitest";
import { axisLabels } from "./axis-labels.js";

describe("axisLabels", () => {
  it("writes values compactly, with at most 6 significant digits", () => {
    expect(axisLabels([0.45, 1, 0.1 + 0.2, 1 / 3, -2.5, 1e-7])).toEqual([
      "0.45",
      "1",
      "0.3", // 0.30000000000000004 rounds to 0.3 at 6 digits
      "0.333333",
      "-2.5",
      "1e-7",
    ]);
  });

  it("writes -0 as 0", () => {
    expect(axisLabels([-0, 1])).toEqual(["0", "1"]);
  });

  it("adds digits until values that read alike at 6 digits are told apart", () => {
    const labels = axisLabels([0.1234561, 0.1234564, 0.5]);
    expect(new Set(labels).size).toBe(3);
    expect(labels).toEqual(["0.1234561", "0.1234564", "0.5"]);
  });

  it("tells apart neighbouring doubles", () => {
    const x = 0.7;
    const next = x + Number.EPSILON / 2; // the next double above 0.7
    expect(next).not.toBe(x);
    const labels = axisLabels([x, next]);
    expect(labels[0]).not.toBe(labels[1]);
    expect(labels.map(Number)).toEqual([x, next]); // 17 digits round-trip exactly
  });

  it("refuses repeated values", () => {
    expect(() => axisLabels([1, 1])).toThrow(RangeError);
  });

  it("goes up to 17 digits: 0.1 and the next double above it read alike at 16", () => {
    const next = 0.1 + 2 ** -56; // one unit in the last place of 0.1 (2^-4 · 2^-52)
    expect(next).not.toBe(0.1);
    expect(Number(next.toPrecision(16))).toBe(0.1); // alike at 16 significant digits
    expect(axisLabels([0.1, next])).toEqual(["0.1", "0.10000000000000002"]);
  });

  it("says why repeated values are refused", () => {
    expect(() => axisLabels([2, 2])).toThrow("axis values repeat, so their columns cannot be told apart");
  });
});

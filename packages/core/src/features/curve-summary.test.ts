import { describe, expect, it } from "vitest";
import { summarizeCurve } from "./curve-summary.js";

describe("summarizeCurve", () => {
  it("integrates a straight line exactly (trapezoid rule; common practice)", () => {
    // y = 2x on [0, 3] sampled unevenly: area = x² |₀³ = 9.
    const axis = [0, 0.5, 2, 3];
    const s = summarizeCurve(
      axis.map((x) => 2 * x),
      axis,
    );
    expect(s.area).toBeCloseTo(9, 12);
    expect(s.max).toBe(6);
    expect(s.peakAt).toBe(3);
  });

  it("reports where the maximum is first reached", () => {
    const s = summarizeCurve([1, 4, 2, 4, 0], [10, 20, 30, 40, 50]);
    expect(s.max).toBe(4);
    expect(s.peakAt).toBe(20);
    // Hand-computed: 10·(1+4)/2 + 10·(4+2)/2 + 10·(2+4)/2 + 10·(4+0)/2 = 25 + 30 + 30 + 20.
    expect(s.area).toBe(105);
  });

  it("gives a positive area on a descending (similarity) axis", () => {
    const up = summarizeCurve([0, 1, 3], [0, 1, 2]);
    const down = summarizeCurve([0, 1, 3], [2, 1, 0]);
    expect(down.area).toBe(up.area);
    expect(down.area).toBe(2.5); // (0+1)/2 + (1+3)/2
    expect(down.peakAt).toBe(0);
  });

  it("gives area 0 for a single point and handles negative curves", () => {
    expect(summarizeCurve([7], [0.3])).toEqual({ max: 7, peakAt: 0.3, area: 0 });
    const s = summarizeCurve([-3, -1, -2], [0, 1, 2]);
    expect(s.max).toBe(-1);
    expect(s.peakAt).toBe(1);
    expect(s.area).toBe(-3.5); // (-3-1)/2 + (-1-2)/2
  });

  it("reads one column of a strided table", () => {
    // Rows are axis points, columns are two curves: [a0 b0 a1 b1 a2 b2].
    const table = [1, 10, 2, 30, 3, 20];
    expect(summarizeCurve(table, [0, 1, 2], 2, 1)).toEqual({ max: 30, peakAt: 1, area: 45 });
    expect(summarizeCurve(table, [0, 1, 2], 2, 0)).toEqual({ max: 3, peakAt: 2, area: 4 });
  });

  it("refuses a curve with no points", () => {
    expect(() => summarizeCurve([], [])).toThrow(RangeError);
    expect(() => summarizeCurve([], [])).toThrow("a curve needs at least one point");
  });
});

import { describe, expect, it } from "vitest";
import { noise, normals, series } from "./connectivity.fixture.js";
import { laggedCrossCorrelation } from "./lagged-cross-correlation.js";

describe("laggedCrossCorrelation", () => {
  it("recovers planted lags and directions, signs kept (the series are built with them)", () => {
    // x0 is a smooth random signal; x1 follows it 3 steps later, x3 follows it 2 steps later with the
    // opposite sign; x2 is unrelated. The arcs 0→1 (lag 3, +) and 0→3 (lag 2, −) must stand out.
    const T = 2000;
    const next = normals(21);
    const x0 = new Array(T).fill(0);
    for (let t = 1; t < T; t++) x0[t] = 0.6 * x0[t - 1] + next();
    const x1 = x0.map((_, t) => (t >= 3 ? x0[t - 3] : 0) + 0.4 * next());
    const x3 = x0.map((_, t) => (t >= 2 ? -x0[t - 2] : 0) + 0.4 * next());
    const [x2] = noise(1, T, 22);
    const n = 4;
    const { values, lags } = laggedCrossCorrelation(series([x0, x1, x2, x3]), 6);
    const arc = (i: number, j: number) => ({ r: values[i * n + j], lag: lags[i * n + j] });
    expect(arc(0, 1).lag).toBe(3);
    expect(arc(0, 1).r).toBeGreaterThan(0.9);
    expect(arc(0, 3).lag).toBe(2);
    expect(arc(0, 3).r).toBeLessThan(-0.9);
    // The reverse arcs only see the signal's own memory (x0 leading itself), well below the planted ones.
    expect(Math.abs(arc(1, 0).r)).toBeLessThan(0.6 * Math.abs(arc(0, 1).r));
    expect(Math.abs(arc(3, 0).r)).toBeLessThan(0.6 * Math.abs(arc(0, 3).r));
    // x1 lags x3 by one step (with the opposite sign).
    expect(arc(3, 1)).toEqual({ r: expect.any(Number), lag: 1 });
    expect(arc(3, 1).r).toBeLessThan(-0.8);
    for (const j of [0, 1, 3]) expect(Math.abs(arc(2, j).r)).toBeLessThan(0.1);
    for (let i = 0; i < n; i++) expect([values[i * n + i], lags[i * n + i]]).toEqual([0, 0]);
  });

  it("a segment without variation correlates 0 at that lag, not NaN", () => {
    const x = [5, 5, 5, 5, 1, 2, 3];
    const y = [1, 3, 2, 4, 3, 5, 4];
    const { values } = laggedCrossCorrelation(series([x, y]), 3);
    expect(values.every(Number.isFinite)).toBe(true);
  });
});

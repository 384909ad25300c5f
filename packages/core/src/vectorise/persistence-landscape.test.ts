import { describe, expect, it } from "vitest";
import { persistenceLandscape } from "./persistence-landscape.js";

// P. Bubenik, "Statistical topological data analysis using persistence landscapes", JMLR 16 (2015),
// Definition 3: λ_k(t) = k-th largest of max(0, min(t − b_i, d_i − t)).
describe("persistence landscapes (Bubenik 2015, Definition 3)", () => {
  const samples = [0, 1, 2, 3, 4, 5, 6, 7, 8];

  it("one bar (b, d): layer 1 is the tent of height (d − b)/2 at (b + d)/2, higher layers are zero", () => {
    const [b, d] = [2, 6];
    const out = persistenceLandscape([b], [d], 3, samples);
    const T = samples.length;
    expect(Array.from(out.subarray(0, T))).toEqual([0, 0, 0, 1, 2, 1, 0, 0, 0]);
    expect(Math.max(...out.subarray(0, T))).toBe((d - b) / 2);
    expect(out[samples.indexOf((b + d) / 2)]).toBe((d - b) / 2);
    expect(Array.from(out.subarray(T))).toEqual(new Array(2 * T).fill(0));
  });

  it("two overlapping bars (0, 6) and (2, 8), worked by hand", () => {
    // Tents: f1(t) = min(t, 6 − t)+, f2(t) = min(t − 2, 8 − t)+.
    //   t:   0  1  2  3  4  5  6  7  8
    //   f1:  0  1  2  3  2  1  0  0  0
    //   f2:  0  0  0  1  2  3  2  1  0
    const out = persistenceLandscape([0, 2], [6, 8], 3, samples);
    const T = samples.length;
    expect(Array.from(out.subarray(0, T))).toEqual([0, 1, 2, 3, 2, 3, 2, 1, 0]); // λ1 = max
    expect(Array.from(out.subarray(T, 2 * T))).toEqual([0, 0, 0, 1, 2, 1, 0, 0, 0]); // λ2 = min
    expect(Array.from(out.subarray(2 * T))).toEqual(new Array(T).fill(0));
  });

  it("every layer is right at the first sample too, where both bars are alive", () => {
    // The bars above sampled at t = 3, 4, 5 only (f1 = 3 2 1, f2 = 1 2 3): λ2(3) = 1 is not 0.
    const out = persistenceLandscape([0, 2], [6, 8], 2, [3, 4, 5]);
    expect(Array.from(out)).toEqual([3, 2, 3, 1, 2, 1]);
  });

  it("one layer is λ1 alone; a layer count below 1 or not an integer is refused", () => {
    // λ1 of the two bars above: the upper envelope of the tents, worked by hand.
    const out = persistenceLandscape([0, 2], [6, 8], 1, samples);
    expect(Array.from(out)).toEqual([0, 1, 2, 3, 2, 3, 2, 1, 0]);
    expect(() => persistenceLandscape([0], [1], 0, [0])).toThrow("layers must be an integer ≥ 1, got 0");
    expect(() => persistenceLandscape([0], [1], 1.5, [0])).toThrow("layers must be an integer ≥ 1, got 1.5");
  });
});

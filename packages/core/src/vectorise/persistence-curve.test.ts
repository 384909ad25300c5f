import { describe, expect, it } from "vitest";
import { persistenceCurve } from "./persistence-curve.js";

// Y.-M. Chung, A. Lawson, "Persistence curves" (Adv. Comput. Math. 2022): the sum of ψ over points alive
// at t. Two bars [0, 2) and [1, 4) in a window of span 5; the second also open past the end in case two.
describe("persistence curves (Chung & Lawson 2022), by hand", () => {
  const diagram = {
    births: Float64Array.of(0, 1),
    deaths: Float64Array.of(2, 4),
    open: Uint8Array.of(0, 0),
    span: 5,
  };
  const samples = [0, 1, 2, 3, 4, 5];

  it("lifespan: Σ ℓ over alive points (a bar is alive for b ≤ t < d)", () => {
    expect(Array.from(persistenceCurve(diagram, "lifespan", samples))).toEqual([2, 5, 3, 3, 0, 0]);
  });

  it("normalised lifespan and entropy use L = 5", () => {
    expect(Array.from(persistenceCurve(diagram, "normalised-lifespan", samples))).toEqual([
      0.4, 1, 0.6, 0.6, 0, 0,
    ]);
    const h = (x: number) => -x * Math.log(x);
    const entropy = persistenceCurve(diagram, "entropy", samples);
    expect(entropy[1]).toBeCloseTo(h(0.4) + h(0.6), 15);
    expect(entropy[2]).toBeCloseTo(h(0.6), 15);
  });

  it("a bar going on past the window's end is alive at the end, as in the Betti curves", () => {
    const cut = { ...diagram, deaths: Float64Array.of(2, 5), open: Uint8Array.of(0, 1) };
    expect(Array.from(persistenceCurve(cut, "lifespan", samples))).toEqual([2, 6, 4, 4, 4, 4]);
  });
});

import { describe, expect, it } from "vitest";
import { handBar as bar, handBarcode } from "../../../../test/support/hand-barcode.js";
import { explicitGrid } from "../filtration/threshold-grid.js";
import type { WeightSemantics } from "../filtration/weight-semantics.js";
import type { Bar, Barcode } from "./barcode.js";
import { bettiCurves, bettiFromBarcode } from "./betti-curves.js";

// Barcodes written by hand, and their Betti numbers worked by hand from the definition the module states:
// β_k(t) counts the bars of dimension k with birth ≤ t < death in filtration order; before the filtration
// starts, the n vertices stand alone.

/** The hand-written barcode of n vertices whose filtration starts at `start`. */
const barcode = (
  bars: Bar[],
  semantics: WeightSemantics,
  start: number,
  n: number,
  maxDim: number,
): Barcode => handBarcode(bars, semantics, { start, n, maxDim });

describe("bettiFromBarcode and bettiCurves", () => {
  // Four vertices born at 0; components die at 1, 2, 2; one essential. Loops [2, 3), [2, 5), [3, ∞).
  const distance = barcode(
    [bar(0, 0, 1), bar(0, 0, 2), bar(0, 0, 2), bar(0, 0, null), bar(1, 2, 3), bar(1, 2, 5), bar(1, 3, null)],
    "distance",
    0,
    4,
    1,
  );
  const worked: [number, number[]][] = [
    [-1, [4, 0]], // before the start: four lone vertices
    [0, [4, 0]],
    [0.5, [4, 0]],
    [1, [3, 0]], // a death counts at its own value
    [2, [1, 2]],
    [2.5, [1, 2]],
    [3, [1, 2]], // [2, 3) has ended, [3, ∞) has begun
    [4.99, [1, 2]],
    [5, [1, 1]],
    [100, [1, 1]],
  ];

  it("read at one threshold, by the definition (worked by hand)", () => {
    for (const [t, betti] of worked) expect(bettiFromBarcode(distance, t)).toEqual(betti);
  });

  it("on a grid, the same numbers at every grid value", () => {
    const curves = bettiCurves(
      distance,
      explicitGrid(
        worked.map(([t]) => t),
        "distance",
      ),
    );
    expect(curves.map((row) => Array.from(row))).toEqual(worked.map(([, betti]) => betti));
  });

  it("with similarity weights, where thresholds go down", () => {
    // The same barcode in similarity units: weight = −distance value, start 0, so thresholds run 1 … −100.
    const similarity = barcode(
      distance.bars.map((b) => bar(b.dim, -b.birth, b.death === null ? null : -b.death)),
      "similarity",
      0,
      4,
      1,
    );
    for (const [t, betti] of worked) expect(bettiFromBarcode(similarity, -t)).toEqual(betti);
    const curves = bettiCurves(
      similarity,
      explicitGrid(
        worked.map(([t]) => -t),
        "similarity",
      ),
    );
    expect(curves.map((row) => Array.from(row))).toEqual(worked.map(([, betti]) => betti));
  });

  it("at the start itself, where edges of the start value have already joined vertices", () => {
    // Three vertices; an edge at the start value 0 (its zero-length bar not kept) and one at 2.
    const joined = barcode([bar(0, 0, 2), bar(0, 0, null)], "distance", 0, 3, 0);
    expect(bettiFromBarcode(joined, -0.5)).toEqual([3]);
    expect(bettiFromBarcode(joined, 0)).toEqual([2]);
    expect(bettiFromBarcode(joined, 2)).toEqual([1]);
    const curves = bettiCurves(joined, explicitGrid([-0.5, 0, 2], "distance"));
    expect(curves.map((row) => Array.from(row))).toEqual([[3], [2], [1]]);
  });

  it("depends on the bars only, not on their order; every grid value before the start reads n vertices", () => {
    // Two vertices born at 0, joined at 1; loops [1, 3) and [2, 6), listed with the later-born loop first and
    // the components after them, so that neither births nor deaths come in ascending order.
    const shuffled = barcode(
      [bar(1, 2, 6), bar(0, 0, null), bar(1, 1, 3), bar(0, 0, 1)],
      "distance",
      0,
      2,
      1,
    );
    // Worked by hand: β0 = 2 until 1, then 1; β1 counts the loops alive at t (birth ≤ t < death).
    const expected: [number, number[]][] = [
      [-2, [2, 0]],
      [-1, [2, 0]],
      [0, [2, 0]],
      [1, [1, 1]],
      [2, [1, 2]],
      [3, [1, 1]],
      [5, [1, 1]],
      [6, [1, 0]],
    ];
    for (const [t, betti] of expected) expect(bettiFromBarcode(shuffled, t)).toEqual(betti);
    const curves = bettiCurves(
      shuffled,
      explicitGrid(
        expected.map(([t]) => t),
        "distance",
      ),
    );
    expect(curves.map((row) => Array.from(row))).toEqual(expected.map(([, betti]) => betti));
  });

  it("refuses a grid in other units than the barcode's", () => {
    expect(() => bettiCurves(distance, explicitGrid([1], "similarity"))).toThrow(
      'grid semantics "similarity" differ from the barcode\'s "distance"',
    );
  });
});

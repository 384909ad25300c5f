import { describe, expect, it } from "vitest";
import { fromEdgeList } from "../graph/from-edge-list.js";
import { computeBarcode } from "../homology/compute-barcode.js";
import { persistenceEntropy, summarizeBars } from "./bar-summary.js";
import { weightedSquare } from "./weighted-square.fixture.js";

describe("persistenceEntropy", () => {
  it("is ln m for m bars of equal length (follows from the definition H = −Σ p ln p with p = 1/m)", () => {
    for (const m of [1, 2, 5, 17])
      expect(persistenceEntropy(new Array(m).fill(0.3))).toBeCloseTo(Math.log(m), 12);
  });

  it("matches the definition on unequal bars (hand-computed)", () => {
    // Lengths 1 and 3: p = 1/4, 3/4.
    const expected = -(0.25 * Math.log(0.25) + 0.75 * Math.log(0.75));
    expect(persistenceEntropy([1, 3])).toBeCloseTo(expected, 14);
    expect(persistenceEntropy([1, 3])).toBeCloseTo(0.5623351446188083, 12);
  });

  it("is 0 with no bars or no total length, and ignores zero-length bars", () => {
    expect(persistenceEntropy([])).toBe(0);
    expect(persistenceEntropy([0, 0])).toBe(0);
    expect(persistenceEntropy([2, 0, 2])).toBeCloseTo(Math.log(2), 14);
  });
});

describe("summarizeBars", () => {
  // A square 0-1-2-3 with distances 1, 2, 3, 4 and the diagonal 0-2 at 5 (hand-computed; common practice):
  // H0: four components born at 0, three die at 1, 2, 3, one never dies; H1: one loop born at 4, killed at 5.
  const square = weightedSquare();

  it("summarises H0 and H1 of a weighted square (distance weights)", () => {
    const barcode = computeBarcode(square, { semantics: "distance", maxDim: 1 });
    const lengths = [1, 2, 3];
    expect(summarizeBars(barcode, 0)).toEqual({
      count: 3,
      essential: 1,
      totalPersistence: 6,
      maxPersistence: 3,
      entropy: -lengths.reduce((h, l) => h + (l / 6) * Math.log(l / 6), 0),
    });
    expect(summarizeBars(barcode, 1)).toEqual({
      count: 1,
      essential: 0,
      totalPersistence: 1,
      maxPersistence: 1,
      entropy: 0,
    });
  });

  it("measures persistence in weight units when thresholds go down (similarity weights)", () => {
    // Weights 6 − w: edges enter in the same order, so the loop is born at 2 and dies at 1.
    const mirrored = weightedSquare(true);
    const barcode = computeBarcode(mirrored, { semantics: "similarity", maxDim: 1 });
    expect(summarizeBars(barcode, 1)).toMatchObject({ count: 1, totalPersistence: 1, maxPersistence: 1 });
    // Similarity filtrations start at the largest weight (5), where the first merge happens at once: that
    // zero-length bar is dropped, leaving merges at 4 and 3, lengths 1 and 2 (DESIGN.md, "Filtration").
    expect(summarizeBars(barcode, 0)).toMatchObject({
      count: 2,
      essential: 1,
      totalPersistence: 3,
      maxPersistence: 2,
    });
  });

  it("is all zeros for a dimension without bars", () => {
    const barcode = computeBarcode(square, { semantics: "distance", maxDim: 2 });
    expect(summarizeBars(barcode, 2)).toEqual({
      count: 0,
      essential: 0,
      totalPersistence: 0,
      maxPersistence: 0,
      entropy: 0,
    });
  });

  it("takes the longest bar wherever it sits in the bar order, not the last one", () => {
    // Two disjoint squares (worked by hand: a 4-cycle's loop is born when its fourth side enters and dies
    // when a diagonal fills it in): sides 1, 1, 1, 2 and diagonal 9 give H1 [2, 9); sides 1, 1, 1, 3 and
    // diagonal 4 give H1 [3, 4). Bars are sorted by birth, so the longer one comes first.
    const graph = fromEdgeList({
      n: 8,
      sources: [0, 1, 2, 3, 0, 4, 5, 6, 7, 4],
      targets: [1, 2, 3, 0, 2, 5, 6, 7, 4, 6],
      weights: [1, 1, 1, 2, 9, 1, 1, 1, 3, 4],
      directed: false,
    });
    const barcode = computeBarcode(graph, { semantics: "distance", maxDim: 1 });
    const h1 = barcode.bars.filter((bar) => bar.dim === 1).map((bar) => [bar.birth, bar.death]);
    expect(h1).toEqual([
      [2, 9],
      [3, 4],
    ]);
    expect(summarizeBars(barcode, 1)).toMatchObject({ count: 2, totalPersistence: 8, maxPersistence: 7 });
  });
});

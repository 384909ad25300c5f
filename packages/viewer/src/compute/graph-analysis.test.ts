import { bettiAt, countSimplices, fromDenseMatrix } from "@cliquescape/core";
import { describe, expect, it } from "vitest";
import { analyseGraph, DEFAULT_SETTINGS } from "./graph-analysis.js";

// A weighted 5-cycle with one chord: edges enter strongest first (similarity weights).
// 0-1 0.9, 1-2 0.8, 2-3 0.7, 3-4 0.6, 4-0 0.5, 0-2 0.4 (the chord fills triangle 0-1-2 at 0.4).
// NaN: no edge (the diagonal is ignored).
const _ = Number.NaN;
const W = [
  [_, 0.9, 0.4, _, 0.5],
  [0.9, _, 0.8, _, _],
  [0.4, 0.8, _, 0.7, _],
  [_, _, 0.7, _, 0.6],
  [0.5, _, _, 0.6, _],
];
const graph = fromDenseMatrix(5, W.flat(), { directed: false });

describe("analyseGraph", () => {
  const { analysis } = analyseGraph(graph, { ...DEFAULT_SETTINGS, semantics: "similarity" });

  it("has one step per distinct edge value, in entering order, with the edges present there", () => {
    expect(Array.from(analysis.thresholds)).toEqual([0.9, 0.8, 0.7, 0.6, 0.5, 0.4]);
    expect(Array.from(analysis.edgesAt)).toEqual([1, 2, 3, 4, 5, 6]);
    expect(Array.from(analysis.weights)).toEqual([0.9, 0.8, 0.7, 0.6, 0.5, 0.4]);
  });

  it("agrees at every step with countSimplices and with bettiAt (ranks of boundary matrices)", () => {
    analysis.thresholds.forEach((threshold, t) => {
      const counts = countSimplices(graph, { threshold, semantics: "similarity" });
      const row = Array.from(analysis.counts.subarray(t * analysis.countDims, (t + 1) * analysis.countDims));
      expect(row.slice(0, counts.counts.length)).toEqual(Array.from(counts.counts));
      expect(analysis.euler[t]).toBe(counts.euler);
      const betti = bettiAt(graph, { threshold, semantics: "similarity", maxDim: 2 });
      expect(Array.from(analysis.betti.subarray(t * 3, t * 3 + 3))).toEqual(betti);
    });
  });

  it("sees the 5-cycle born at 0.5 and split by the chord at 0.4 (a 4-cycle 0-2-3-4 remains)", () => {
    const at = (w: number) => analysis.betti[analysis.thresholds.indexOf(w) * 3 + 1];
    expect([at(0.6), at(0.5), at(0.4)]).toEqual([0, 1, 1]);
    expect(analysis.loopBars).toHaveLength(1);
    expect(analysis.bars[analysis.loopBars[0]]).toEqual({ dim: 1, birth: 0.5, death: null });
  });
});

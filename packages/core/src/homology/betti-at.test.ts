import { describe, expect, it } from "vitest";
import { fromEdgeList } from "../graph/from-edge-list.js";
import { bettiAt } from "./betti-at.js";
import { HomologyBudgetError } from "./homology-budget.js";

// The hollow octahedron K_{2,2,2}: its clique complex is the boundary of the octahedron, a triangulated
// 2-sphere (textbook: A. Hatcher, Algebraic Topology, 2002, §2.1), so β = (1, 0, 1) over every field.
function octahedron(weight: (u: number, v: number) => number) {
  const sources: number[] = [];
  const targets: number[] = [];
  const weights: number[] = [];
  for (let u = 0; u < 6; u++) {
    for (let v = u + 1; v < 6; v++) {
      if (v === u + 3) continue; // antipodal vertices 0–3, 1–4, 2–5 are not joined
      sources.push(u);
      targets.push(v);
      weights.push(weight(u, v));
    }
  }
  return fromEdgeList({ n: 6, sources, targets, weights, directed: false });
}

describe("bettiAt", () => {
  it("gives the 2-sphere's Betti numbers for the octahedron over Z/2, Z/3 and Z/5", () => {
    const g = octahedron(() => 1);
    for (const prime of [2, 3, 5]) {
      expect(bettiAt(g, { threshold: 1, semantics: "distance", maxDim: 2, prime })).toEqual([1, 0, 1]);
      expect(bettiAt(g, { threshold: 1, semantics: "distance", maxDim: 3, prime })).toEqual([1, 0, 1, 0]);
    }
    expect(bettiAt(g, { threshold: 1, semantics: "distance", maxDim: 0 })).toEqual([1]);
    // Below the edges' weight: six points.
    expect(bettiAt(g, { threshold: 0.5, semantics: "distance", maxDim: 1 })).toEqual([6, 0]);
    // Similarities keep the edges at or above the threshold.
    expect(bettiAt(g, { threshold: 1, semantics: "similarity", maxDim: 2 })).toEqual([1, 0, 1]);
    expect(bettiAt(g, { threshold: 2, semantics: "similarity", maxDim: 2 })).toEqual([6, 0, 0]);
  });

  it("counts each edge's two ends and no other edge, on paths and a star (worked by hand)", () => {
    // The path 0 – 2 – 1: vertex 1's only neighbour is larger, so a boundary that forgot an edge's larger
    // end, or read a neighbour from the next vertex's row, would miscount. A tree: β = (1, 0).
    const path = fromEdgeList({ n: 3, sources: [0, 1], targets: [2, 2], weights: [1, 1], directed: false });
    expect(bettiAt(path, { threshold: 1, semantics: "distance", maxDim: 1 })).toEqual([1, 0]);
    // The star with centre 4 and the two paths 0 – 3, 1 – 2 beside it: three trees.
    const forest = fromEdgeList({
      n: 8,
      sources: [4, 4, 4, 0, 1],
      targets: [5, 6, 7, 3, 2],
      weights: [1, 1, 1, 1, 1],
      directed: false,
    });
    for (const prime of [2, 3])
      expect(bettiAt(forest, { threshold: 1, semantics: "distance", maxDim: 2, prime })).toEqual([3, 0, 0]);
    // The 4-cycle 0 – 2 – 1 – 3 – 0: one loop.
    const square = fromEdgeList({
      n: 4,
      sources: [0, 2, 1, 0],
      targets: [2, 1, 3, 3],
      weights: [1, 1, 1, 1],
      directed: false,
    });
    expect(bettiAt(square, { threshold: 1, semantics: "distance", maxDim: 1, prime: 3 })).toEqual([1, 1]);
  });

  it("refuses a maxDim that is not a non-negative integer", () => {
    const g = octahedron(() => 1);
    for (const maxDim of [-1, 1.5, Number.NaN])
      expect(() => bettiAt(g, { threshold: 1, semantics: "distance", maxDim })).toThrow(
        `maxDim must be a non-negative integer, got ${maxDim}`,
      );
  });

  it("stops with a budget error when the simplices do not fit", () => {
    const g = octahedron(() => 1);
    expect(() =>
      bettiAt(g, { threshold: 1, semantics: "distance", maxDim: 2, budget: { maxBytes: 64 } }),
    ).toThrow(HomologyBudgetError);
  });
});

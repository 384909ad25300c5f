import { describe, expect, it } from "vitest";
import { edgeFiltration } from "../filtration/edge-filtration.js";
import { fromEdgeList } from "../graph/from-edge-list.js";
import { HomologyBudgetError } from "./homology-budget.js";
import { simplicesAtThreshold } from "./simplices-at-threshold.js";

/** K_n with weight u + v on edge u–v. */
function complete(n: number) {
  const sources: number[] = [];
  const targets: number[] = [];
  const weights: number[] = [];
  for (let u = 0; u < n; u++)
    for (let v = u + 1; v < n; v++) {
      sources.push(u);
      targets.push(v);
      weights.push(u + v);
    }
  return fromEdgeList({ n, sources, targets, weights, directed: false });
}

describe("simplicesAtThreshold", () => {
  it("lists the cliques of K_5 up to topDim, ascending vertices, C(5, k + 1) of dimension k", () => {
    const g = complete(5);
    const f = edgeFiltration(g, "distance");
    // topDim below the clique number: the listing stops there (no 4-simplices asked for).
    const lists = simplicesAtThreshold(g, f, Number.POSITIVE_INFINITY, 2, 1e9);
    expect(lists.map((l, d) => l.length / (d + 1))).toEqual([5, 10, 10]);
    expect(Array.from(lists[2].subarray(0, 9))).toEqual([0, 1, 2, 0, 1, 3, 0, 1, 4]);
    // Only edges of weight u + v ≤ 4 at threshold 4: 0–1, 0–2, 0–3, 0–4, 1–2, 1–3; triangles 012, 013.
    const at4 = simplicesAtThreshold(g, f, 4, 3, 1e9);
    expect(Array.from(at4[1])).toEqual([0, 1, 0, 2, 0, 3, 0, 4, 1, 2, 1, 3]);
    expect(Array.from(at4[2])).toEqual([0, 1, 2, 0, 1, 3]);
    expect(at4[3].length).toBe(0);
  });

  it("finds no triangle in a path, and lists vertices alone when topDim is 0", () => {
    // The path 1 – 0 – 3 – 2: vertex 1 has no larger neighbour, and vertex 2's row (3) comes right after
    // its empty row; a scan that ran on into that row would take 0, 1, 3 for a triangle.
    const path = fromEdgeList({
      n: 4,
      sources: [0, 0, 2],
      targets: [1, 3, 3],
      weights: [1, 1, 1],
      directed: false,
    });
    const f = edgeFiltration(path, "distance");
    const lists = simplicesAtThreshold(path, f, 1, 2, 1e9);
    expect(Array.from(lists[1])).toEqual([0, 1, 0, 3, 2, 3]);
    expect(lists[2].length).toBe(0);
    const g = complete(4);
    expect(
      simplicesAtThreshold(g, edgeFiltration(g, "distance"), 10, 0, 1e9).map((l) => Array.from(l)),
    ).toEqual([[0, 1, 2, 3]]);
  });

  it("counts 8 bytes a vertex of every listed edge and higher simplex, and stops past maxBytes", () => {
    // K_4 to dimension 2: 6 edges · 16 + 4 triangles · 24 = 192 bytes (worked by hand).
    const g = complete(4);
    const f = edgeFiltration(g, "distance");
    expect(simplicesAtThreshold(g, f, 10, 2, 192).map((l) => l.length)).toEqual([4, 12, 12]);
    let error: unknown;
    try {
      simplicesAtThreshold(g, f, 10, 2, 191);
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(HomologyBudgetError);
    expect(error).toMatchObject({
      stage: "listing simplices at a threshold",
      neededBytes: 192,
      maxBytes: 191,
    });
  });
});

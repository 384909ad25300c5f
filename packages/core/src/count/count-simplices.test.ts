import { describe, expect, it } from "vitest";
import { explicitGrid } from "../filtration/threshold-grid.js";
import { fromEdgeList } from "../graph/from-edge-list.js";
import type { WeightedGraph } from "../graph/weighted-graph.js";
import { countSimplices } from "./count-simplices.js";
import { SimplexBudgetError } from "./simplex-budget-error.js";
import { sweepSimplexCounts } from "./sweep-simplex-counts.js";

function graph(n: number, edges: [number, number, number?][], directed = false): WeightedGraph {
  return fromEdgeList({
    n,
    directed,
    sources: edges.map((e) => e[0]),
    targets: edges.map((e) => e[1]),
    weights: edges.map((e) => e[2] ?? 1),
  });
}

const list = (a: Float64Array) => Array.from(a);

function binomial(n: number, k: number): number {
  let r = 1;
  for (let i = 1; i <= k; i++) r = (r * (n - k + i)) / i;
  return Math.round(r);
}

/** Complete multipartite graph with `parts` parts of `size` vertices; directed: arcs from lower part to higher. */
function multipartite(parts: number, size: number, mode: "undirected" | "ordered" | "both"): WeightedGraph {
  const edges: [number, number][] = [];
  const n = parts * size;
  for (let u = 0; u < n; u++) {
    for (let v = u + 1; v < n; v++) {
      if (Math.floor(u / size) === Math.floor(v / size)) continue;
      edges.push([u, v]);
      if (mode === "both") edges.push([v, u]);
    }
  }
  return graph(n, edges, mode !== "undirected");
}

describe("countSimplices on hand-checkable graphs", () => {
  it("a triangle is one 2-simplex, χ = 1", () => {
    const r = countSimplices(
      graph(3, [
        [0, 1],
        [1, 2],
        [0, 2],
      ]),
    );
    expect(list(r.counts)).toEqual([3, 3, 1]);
    expect(r.euler).toBe(1);
    expect(r.truncated).toBe(false);
  });

  it("K4 is a solid tetrahedron: 4, 6, 4, 1 and χ = 1", () => {
    const r = countSimplices(
      graph(4, [
        [0, 1],
        [0, 2],
        [0, 3],
        [1, 2],
        [1, 3],
        [2, 3],
      ]),
    );
    expect(list(r.counts)).toEqual([4, 6, 4, 1]);
    expect(r.euler).toBe(1);
  });

  it("a 4-cycle has no triangle: χ = 0 (one loop)", () => {
    const r = countSimplices(
      graph(4, [
        [0, 1],
        [1, 2],
        [2, 3],
        [3, 0],
      ]),
    );
    expect(list(r.counts)).toEqual([4, 4]);
    expect(r.euler).toBe(0);
  });

  it("isolated vertices are 0-simplices; an empty graph has no simplices", () => {
    expect(list(countSimplices(graph(5, [[0, 1]])).counts)).toEqual([5, 1]);
    expect(list(countSimplices(graph(0, [])).counts)).toEqual([]);
    expect(countSimplices(graph(0, [])).euler).toBe(0);
  });

  it("a directed 3-cycle has no 2-simplex, a transitive triangle has exactly one", () => {
    const cycle = countSimplices(
      graph(
        3,
        [
          [0, 1],
          [1, 2],
          [2, 0],
        ],
        true,
      ),
    );
    expect(list(cycle.counts)).toEqual([3, 3]);
    const transitive = countSimplices(
      graph(
        3,
        [
          [0, 1],
          [1, 2],
          [0, 2],
        ],
        true,
      ),
      { participation: true },
    );
    expect(list(transitive.counts)).toEqual([3, 3, 1]);
    const p = transitive.participation!;
    expect(list(p.source![2])).toEqual([1, 0, 0]);
    expect(list(p.sink![2])).toEqual([0, 0, 1]);
    expect(list(p.member[2])).toEqual([1, 1, 1]);
  });

  it("a reciprocal pair gives two 1-simplices and no 2-simplex", () => {
    expect(
      list(
        countSimplices(
          graph(
            2,
            [
              [0, 1],
              [1, 0],
            ],
            true,
          ),
        ).counts,
      ),
    ).toEqual([2, 2]);
  });

  it("a symmetric digraph has (k+1)! directed k-simplices per clique (definition of the directed flag complex)", () => {
    const r = countSimplices(multipartite(4, 1, "both"));
    // K4 with both arcs: 4 vertices, 12 arcs, 4·3! = 24 triangles, 1·4! = 24 tetrahedra
    expect(list(r.counts)).toEqual([4, 12, 24, 24]);
  });

  it("complete multipartite graphs: C(r, k+1)·a^(k+1) cliques (common practice: choose k+1 parts, one vertex each)", () => {
    // 4 parts of 25: local universes of up to 75 vertices, so the multi-word and compaction paths run
    const parts = 4;
    const size = 25;
    const want = [1, 2, 3, 4].map((j) => binomial(parts, j) * size ** j);
    expect(list(countSimplices(multipartite(parts, size, "undirected")).counts)).toEqual(want);
    expect(list(countSimplices(multipartite(parts, size, "ordered")).counts)).toEqual(want);
    const factorial = [1, 1, 2, 6, 24];
    const both = countSimplices(multipartite(parts, size, "both"));
    expect(list(both.counts)).toEqual(want.map((c, k) => c * factorial[k + 1]));
    const annotated = countSimplices(multipartite(parts, size, "both"), { participation: true });
    expect(list(annotated.counts)).toEqual(list(both.counts));
  });

  it("3 parts of 70: candidate sets above 64 members (the re-packed wide universe) count the same", () => {
    const want = [1, 2, 3].map((j) => binomial(3, j) * 70 ** j);
    for (const mode of ["undirected", "ordered", "both"] as const) {
      const g = multipartite(3, 70, mode);
      const expected = mode === "both" ? want.map((c, k) => c * [1, 2, 6][k]) : want;
      expect(list(countSimplices(g).counts)).toEqual(expected);
      expect(list(countSimplices(g, { maxDim: 1 }).counts)).toEqual(expected.slice(0, 2));
      expect(countSimplices(g, { maxDim: 1 }).truncated).toBe(true);
    }
  });
});

/** Seeded pseudo-random graph (mulberry32), dense enough for local universes above 64 vertices. */
function randomGraph(n: number, p: number, directed: boolean, seed: number): WeightedGraph {
  let a = seed >>> 0;
  const rand = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const edges: [number, number, number][] = [];
  for (let u = 0; u < n; u++) {
    for (let v = directed ? 0 : u + 1; v < n; v++) if (u !== v && rand() < p) edges.push([u, v, rand()]);
  }
  return graph(n, edges, directed);
}

describe("the fast path, the annotated path and the sweep agree on larger graphs", () => {
  for (const [n, p, directed] of [
    [130, 0.55, false],
    [90, 0.35, true],
    [300, 0.3, false],
  ] as const) {
    it(`random graph n=${n} p=${p} ${directed ? "directed" : "undirected"}`, () => {
      const g = randomGraph(n, p, directed, 7 + n);
      const fast = countSimplices(g);
      const full = countSimplices(g, { participation: true, edgeParticipation: true });
      expect(list(full.counts)).toEqual(list(fast.counts));
      const grid = explicitGrid([0.25, 0.5, 0.75, 1], "distance");
      const sweep = sweepSimplexCounts(g, grid);
      expect(list(sweep.counts[3])).toEqual(list(fast.counts));
      const mid = countSimplices(g, { threshold: 0.5, semantics: "distance" });
      const row = list(sweep.counts[1]).slice(0, mid.counts.length);
      expect(row).toEqual(list(mid.counts));
      // participation sums: each k-simplex has k+1 vertices, one source, one sink, C(k+1, 2) edges
      const part = full.participation!;
      full.counts.forEach((c, k) => {
        expect(part.member[k].reduce((s, x) => s + x, 0)).toBe((k + 1) * c);
        if (directed) {
          expect(part.source![k].reduce((s, x) => s + x, 0)).toBe(c);
          expect(part.sink![k].reduce((s, x) => s + x, 0)).toBe(c);
        }
        const slotsPerEdge = directed ? 1 : 2;
        expect(full.edgeParticipation![k].reduce((s, x) => s + x, 0)).toBe(
          slotsPerEdge * binomial(k + 1, 2) * c,
        );
      });
    });
  }
});

describe("limits", () => {
  const k6 = multipartite(6, 1, "undirected"); // 6, 15, 20, 15, 6, 1: 63 simplices

  it("maxDim caps the counts and reports truncation", () => {
    const r = countSimplices(k6, { maxDim: 2 });
    expect(list(r.counts)).toEqual([6, 15, 20]);
    expect(r.truncated).toBe(true);
    expect(r.euler).toBe(6 - 15 + 20);
    expect(countSimplices(k6, { maxDim: 5 }).truncated).toBe(false);
    expect(list(countSimplices(k6, { maxDim: 0 }).counts)).toEqual([6]);
    expect(countSimplices(k6, { maxDim: 0 }).truncated).toBe(true);
    expect(countSimplices(graph(3, []), { maxDim: 0 }).truncated).toBe(false);
  });

  it("the budget stops with SimplexBudgetError saying how far it got", () => {
    for (const participation of [false, true]) {
      let caught: unknown;
      try {
        countSimplices(k6, { budget: 40, participation });
      } catch (e) {
        caught = e;
      }
      expect(caught).toBeInstanceOf(SimplexBudgetError);
      const err = caught as SimplexBudgetError;
      expect(err.budget).toBe(40);
      expect(err.counted[0]).toBe(6);
      const total = err.counted.reduce((a, b) => a + b, 0);
      expect(total).toBeGreaterThan(40);
      expect(total).toBeLessThanOrEqual(63);
      expect(err.message).toMatch(/budget of 40 exceeded/);
    }
    expect(list(countSimplices(k6, { budget: 63 }).counts)).toEqual([6, 15, 20, 15, 6, 1]);
    expect(() => sweepSimplexCounts(k6, explicitGrid([1], "distance"), { budget: 10 })).toThrow(
      SimplexBudgetError,
    );
  });

  it("a budget passed only once the count is complete says so, with no extrapolation", () => {
    const k4 = multipartite(4, 1, "undirected"); // 4, 6, 4, 1: 15 simplices
    for (const participation of [false, true]) {
      let caught: unknown;
      try {
        countSimplices(k4, { budget: 14, participation });
      } catch (e) {
        caught = e;
      }
      expect(caught).toBeInstanceOf(SimplexBudgetError);
      const err = caught as SimplexBudgetError;
      expect(list(err.counted)).toEqual([4, 6, 4, 1]);
      expect(err.progress).toBe(1);
      expect(err.message).toMatch(/count is complete/);
      expect(err.message).not.toMatch(/extrapolation/);
    }
    // stopped inside the work: the share done excludes unfinished roots and the estimate is finite
    const k8 = multipartite(8, 1, "undirected");
    let stopped: unknown;
    try {
      countSimplices(k8, { budget: 40 });
    } catch (e) {
      stopped = e;
    }
    expect(stopped).toBeInstanceOf(SimplexBudgetError);
    expect((stopped as SimplexBudgetError).progress).toBeLessThan(1);
    expect((stopped as SimplexBudgetError).message).not.toMatch(/count is complete/);
  });

  it("rejects bad limits and a threshold without semantics", () => {
    expect(() => countSimplices(k6, { maxDim: -1 })).toThrow(RangeError);
    expect(() => countSimplices(k6, { maxDim: 1.5 })).toThrow(RangeError);
    expect(() => countSimplices(k6, { budget: Number.NaN })).toThrow(RangeError);
    // the messages name the limit and the value given
    expect(() => countSimplices(k6, { maxDim: -1 })).toThrow(/maxDim must be a non-negative integer, got -1/);
    expect(() => countSimplices(k6, { budget: -2 })).toThrow(/budget must be a non-negative number, got -2/);
    // budget 0 is allowed (non-negative): K6 then stops on the budget, it is not refused as a bad limit
    expect(() => countSimplices(k6, { budget: 0 })).toThrow(SimplexBudgetError);
    expect(() => countSimplices(k6, { threshold: 1 })).toThrow(TypeError);
    expect(() => countSimplices(k6, { threshold: 1 })).toThrow(
      "a threshold needs semantics: 'distance' or 'similarity'",
    );
  });

  it("refuses a NaN threshold (it would keep no edge and look like a valid, empty answer)", () => {
    for (const semantics of ["distance", "similarity"] as const) {
      expect(() => countSimplices(k6, { threshold: Number.NaN, semantics })).toThrow(RangeError);
      expect(() => countSimplices(k6, { threshold: Number.NaN, semantics })).toThrow("the threshold is NaN");
    }
  });

  it("the budget message of a real count, worked by hand on three disjoint triangles", () => {
    // 9 vertices and 9 edges are counted up front (18); in the degeneracy numbering one root per triangle
    // has two later neighbours (the only roots with work for the plain kernels) and adds one triangle.
    const triangles = graph(9, [
      [0, 1],
      [1, 2],
      [0, 2],
      [3, 4],
      [4, 5],
      [3, 5],
      [6, 7],
      [7, 8],
      [6, 8],
    ]);
    const messageOf = (options: Parameters<typeof countSimplices>[1]) => {
      try {
        countSimplices(triangles, options);
      } catch (e) {
        expect(e).toBeInstanceOf(SimplexBudgetError);
        return (e as SimplexBudgetError).message;
      }
      throw new Error("the budget was not passed");
    };
    const tail = "Raise the budget, lower maxDim, or use a sparser threshold.";
    for (const kernel of ["typescript", "webassembly"] as const) {
      // budget 17: passed by the 18 counted up front, before any root
      expect(messageOf({ budget: 17, kernel }), kernel).toBe(
        `simplex budget of 17 exceeded after 18 simplices with 0.0% of root vertices done; counted so far dim 0: 9, dim 1: 9. ${tail}`,
      );
      // budget 19: the second triangle makes 20; two of three roots done; 18 + 2 / (2/3) = 21 in all
      expect(messageOf({ budget: 19, kernel }), kernel).toBe(
        "simplex budget of 19 exceeded after 20 simplices with 66.7% of root vertices done " +
          `(a rough extrapolation: 2.10e+1 in all); counted so far dim 0: 9, dim 1: 9, dim 2: 2. ${tail}`,
      );
    }
    // With participation only the 9 vertices are counted up front; roots with work are those with a later
    // neighbour (two per triangle), each adding its edges and triangle: 12, 13, 16, 17, then 20 when the
    // third triangle's first root ends. 5 of 6 roots done; 9 + (20 − 9) / (5/6) = 22.2 in all.
    expect(messageOf({ budget: 19, participation: true })).toBe(
      "simplex budget of 19 exceeded after 20 simplices with 83.3% of root vertices done " +
        `(a rough extrapolation: 2.22e+1 in all); counted so far dim 0: 9, dim 1: 8, dim 2: 3. ${tail}`,
    );
  });
});

describe("a budget passed inside the first root's subtree", () => {
  it("reports no root finished (0.0 %), with vertices and edges counted in full", () => {
    // K_{2,2,2,2,2} (10 vertices, each joined to all but its partner: 40 edges, 50 simplices up front).
    // Every root's local universe is a smaller cocktail-party graph, never a clique, so the kernels expand
    // it and check the budget at the end of every expansion; the first root alone adds 24 triangles
    // (its 8 later neighbours span C(8, 2) − 4 edges), so a budget of 51 runs out inside its subtree.
    const cocktail = multipartite(5, 2, "undirected");
    for (const [kernel, participation] of [
      ["typescript", false],
      ["webassembly", false],
      ["auto", true],
    ] as const) {
      let caught: unknown;
      try {
        countSimplices(cocktail, { budget: 51, kernel, participation });
      } catch (e) {
        caught = e;
      }
      expect(caught, kernel).toBeInstanceOf(SimplexBudgetError);
      const err = caught as SimplexBudgetError;
      expect(err.progress, kernel).toBe(0);
      expect(err.message, kernel).toMatch(/with 0\.0% of root vertices done;/);
      if (!participation) expect(list(err.counted).slice(0, 2), kernel).toEqual([10, 40]);
    }
  });
});

describe("participation tables only when asked for", () => {
  const t = graph(3, [
    [0, 1],
    [1, 2],
    [0, 2],
  ]);
  it("plain counts have neither field; each option adds its own field and not the other", () => {
    expect(Object.keys(countSimplices(t)).sort()).toEqual(["counts", "euler", "truncated"]);
    const nodes = countSimplices(t, { participation: true });
    expect(Object.keys(nodes).sort()).toEqual(["counts", "euler", "participation", "truncated"]);
    // a triangle: every vertex is in itself, two edges and the triangle
    expect(nodes.participation!.member.map(list)).toEqual([
      [1, 1, 1],
      [2, 2, 2],
      [1, 1, 1],
    ]);
    const edges = countSimplices(t, { edgeParticipation: true });
    expect(Object.keys(edges).sort()).toEqual(["counts", "edgeParticipation", "euler", "truncated"]);
    // both slots of each edge: in the edge itself and in the triangle
    expect(edges.edgeParticipation!.map(list)).toEqual([
      [0, 0, 0, 0, 0, 0],
      [1, 1, 1, 1, 1, 1],
      [1, 1, 1, 1, 1, 1],
    ]);
  });
});

describe("thresholds follow the weight semantics", () => {
  // triangle with weights 1, 2, 3
  const t = graph(3, [
    [0, 1, 1],
    [1, 2, 2],
    [0, 2, 3],
  ]);
  it("distance: threshold W keeps w ≤ W", () => {
    expect(list(countSimplices(t, { threshold: 2, semantics: "distance" }).counts)).toEqual([3, 2]);
    expect(list(countSimplices(t, { threshold: 3, semantics: "distance" }).counts)).toEqual([3, 3, 1]);
  });
  it("similarity: threshold W keeps w ≥ W", () => {
    expect(list(countSimplices(t, { threshold: 2, semantics: "similarity" }).counts)).toEqual([3, 2]);
    expect(list(countSimplices(t, { threshold: 1, semantics: "similarity" }).counts)).toEqual([3, 3, 1]);
  });
  it("the sweep gives counts and χ at every threshold", () => {
    const s = sweepSimplexCounts(t, explicitGrid([0, 1, 2, 3], "distance"));
    expect(s.counts.map(list)).toEqual([
      [3, 0, 0],
      [3, 1, 0],
      [3, 2, 0],
      [3, 3, 1],
    ]);
    expect(list(s.euler)).toEqual([3, 2, 1, 1]);
    expect(list(s.thresholds)).toEqual([0, 1, 2, 3]);
  });
  it("both sweep kernels, asked for by name, give the hand-counted K4 at every threshold", () => {
    // K4: the triangle 0-1-2 at weight 1, the three edges to vertex 3 at weight 2 (hand-counted:
    // nothing, then a filled triangle, then the solid tetrahedron 4, 6, 4, 1)
    const k4 = graph(4, [
      [0, 1, 1],
      [1, 2, 1],
      [0, 2, 1],
      [0, 3, 2],
      [1, 3, 2],
      [2, 3, 2],
    ]);
    for (const kernel of ["webassembly", "typescript", "auto"] as const) {
      const s = sweepSimplexCounts(k4, explicitGrid([0.5, 1, 2], "distance"), { maxDim: 3, kernel });
      expect(s.counts.map(list), kernel).toEqual([
        [4, 0, 0, 0],
        [4, 3, 1, 0],
        [4, 6, 4, 1],
      ]);
      expect(list(s.euler), kernel).toEqual([4, 2, 1]);
      expect(s.truncated, kernel).toBe(false);
    }
  });
  it("the sweep refuses an unknown kernel name, and an empty grid gives no rows (and does no counting)", () => {
    // @ts-expect-error: a caller from JavaScript can pass anything
    expect(() => sweepSimplexCounts(t, explicitGrid([1], "distance"), { kernel: "wasm" })).toThrow(
      /kernel must be "auto", "webassembly" or "typescript", got wasm/,
    );
    const empty = sweepSimplexCounts(t, explicitGrid([], "distance"), { budget: 0 });
    expect(empty.counts).toEqual([]);
    expect(empty.euler.length).toBe(0);
    expect(empty.truncated).toBe(false);
  });
});

import { afterEach, describe, expect, it, vi } from "vitest";
import { factorial } from "../../../../../test/support/combinatorics.js";
import { digraphOf } from "../../../../../test/support/known-graphs.js";
import { elementary, type Mode, multipartite } from "../../../../../test/support/multipartite.js";
import { fromEdgeList } from "../../graph/from-edge-list.js";
import { countSimplices } from "../count-simplices.js";
import { SimplexBudgetError } from "../simplex-budget-error.js";
import { countKernel, discardKernel } from "./count-kernel.js";

/** Complete graph K_n, undirected, or directed with every arc both ways. */
function complete(n: number, directed = false) {
  const sources: number[] = [];
  const targets: number[] = [];
  for (let u = 0; u < n; u++)
    for (let v = directed ? 0 : u + 1; v < n; v++)
      if (u !== v) {
        sources.push(u);
        targets.push(v);
      }
  return fromEdgeList({ n, directed, sources, targets, weights: sources.map(() => 1) });
}

/** K_{2,…,2} with `pairs` pairs: every vertex joined to all but its partner (2i, 2i + 1). */
function cocktailParty(pairs: number) {
  const sources: number[] = [];
  const targets: number[] = [];
  for (let u = 0; u < 2 * pairs; u++)
    for (let v = u + 1; v < 2 * pairs; v++)
      if (u >> 1 !== v >> 1) {
        sources.push(u);
        targets.push(v);
      }
  return fromEdgeList({ n: 2 * pairs, directed: false, sources, targets, weights: sources.map(() => 1) });
}

/** C(n, k) by the multiplicative formula (exact for the small values here). */
function binomial(n: number, k: number): number {
  let r = 1;
  for (let i = 1; i <= k; i++) r = (r * (n - k + i)) / i;
  return Math.round(r);
}

afterEach(() => {
  vi.unstubAllGlobals();
  vi.resetModules();
});

describe("the WebAssembly counting kernel", () => {
  it("loads synchronously from the embedded bytes", () => {
    const kernel = countKernel();
    expect(kernel).not.toBeNull();
    expect(typeof kernel?.countRoots).toBe("function");
  });

  // K_n has C(n, k+1) k-simplices (common practice); K_70 spans two 64-bit words per row, K_130 three.
  it.each([5, 40, 64, 65, 70, 130])("counts K_%i like the formula and the TypeScript kernel", (n) => {
    const g = complete(n);
    const cap = { maxDim: 4, budget: Number.POSITIVE_INFINITY };
    const wasm = countSimplices(g, { ...cap, kernel: "webassembly" });
    const ts = countSimplices(g, { ...cap, kernel: "typescript" });
    expect(Array.from(wasm.counts)).toEqual(Array.from({ length: 5 }, (_, k) => binomial(n, k + 1)));
    expect(wasm).toEqual(ts);
    expect(wasm.truncated).toBe(n > 5);
  });

  it("counts a complete digraph's ordered tuples, n!/(n−k−1)! per dimension", () => {
    const g = complete(9, true);
    const wasm = countSimplices(g, { kernel: "webassembly" });
    const falling = (k: number) => Array.from({ length: k + 1 }, (_, i) => 9 - i).reduce((a, b) => a * b, 1);
    expect(Array.from(wasm.counts)).toEqual(Array.from({ length: 9 }, (_, k) => falling(k)));
    expect(wasm).toEqual(countSimplices(g, { kernel: "typescript" }));
  });

  it("stops on the budget with the counts so far, like the TypeScript kernel", () => {
    const g = complete(30, true);
    for (const kernel of ["webassembly", "typescript"] as const) {
      let caught: unknown;
      try {
        countSimplices(g, { budget: 5e6, kernel });
      } catch (e) {
        caught = e;
      }
      expect(caught).toBeInstanceOf(SimplexBudgetError);
      const counted = Array.from((caught as SimplexBudgetError).counted);
      expect(counted.slice(0, 2)).toEqual([30, 870]); // vertices and arcs are counted up front
      expect(counted[2]).toBeLessThanOrEqual(30 * 29 * 28);
      expect(counted.reduce((a, b) => a + b, 0)).toBeGreaterThan(5e6);
      expect((caught as SimplexBudgetError).progress).toBeLessThan(1);
    }
  });

  it("stops an undirected count where the TypeScript kernel stops, roots taken in the same order", () => {
    // Two K5s on the even and on the odd vertices. The TypeScript counter takes roots in the degeneracy
    // numbering; the WebAssembly kernel must too for undirected graphs (only directed lists are renumbered
    // breadth-first): the simplices counted and the share of roots finished at a budget stop then agree
    // (countWithWasm's contract: the same budget errors as the TypeScript counter). Budgets from the 30
    // simplices counted up front (10 vertices, 20 edges) to one below the total, 2·31 − 1 = 61 (K5 has
    // 2^5 − 1 = 31 nonempty cliques, common practice).
    const sources: number[] = [];
    const targets: number[] = [];
    for (let u = 0; u < 10; u++)
      for (let v = u + 2; v < 10; v += 2) {
        sources.push(u);
        targets.push(v);
      }
    const g = fromEdgeList({ n: 10, directed: false, sources, targets, weights: sources.map(() => 1) });
    expect(Array.from(countSimplices(g, { kernel: "webassembly" }).counts)).toEqual([10, 20, 20, 10, 2]);
    const stop = (budget: number, kernel: "webassembly" | "typescript") => {
      try {
        countSimplices(g, { budget, kernel });
      } catch (e) {
        const error = e as SimplexBudgetError;
        return { counted: Array.from(error.counted), progress: error.progress };
      }
      return null;
    };
    for (let budget = 30; budget < 62; budget++) {
      const wasm = stop(budget, "webassembly");
      expect(wasm, `budget ${budget}`).not.toBeNull();
      expect(wasm, `budget ${budget}`).toEqual(stop(budget, "typescript"));
    }
  });

  it("falls back to the TypeScript kernel where WebAssembly is missing, and says so when it was asked for", async () => {
    vi.stubGlobal("WebAssembly", undefined);
    vi.resetModules();
    const fresh = await import("../count-simplices.js");
    const g = complete(12);
    expect(Array.from(fresh.countSimplices(g).counts)).toEqual(
      Array.from({ length: 12 }, (_, k) => binomial(12, k + 1)),
    );
    expect(() => fresh.countSimplices(g, { kernel: "webassembly" })).toThrow(
      "the WebAssembly counting kernel is not available here, or its memory cannot hold this graph's tables " +
        '(kernel: "webassembly" was asked for; "auto" would count in TypeScript)',
    );
    const freshSweep = await import("../sweep-simplex-counts.js");
    const grid = { thresholds: Float64Array.from([1]), semantics: "distance" as const };
    expect(() => freshSweep.sweepSimplexCounts(g, grid, { maxDim: 3, kernel: "webassembly" })).toThrow(
      /WebAssembly counting kernel is not available/,
    );
  });

  it("counts only vertices at maxDim 0 and vertices and edges at maxDim 1, flagging the rest as cut off", () => {
    // K6: 6 vertices, 15 edges, 20 triangles (C(6, k+1), common practice)
    const k6 = complete(6);
    for (const kernel of ["webassembly", "typescript"] as const) {
      const dim0 = countSimplices(k6, { maxDim: 0, kernel });
      expect(Array.from(dim0.counts), kernel).toEqual([6]);
      expect(dim0.truncated, kernel).toBe(true);
      // at maxDim 0 only the 6 vertices count towards the budget, not the edges left out
      expect(Array.from(countSimplices(k6, { maxDim: 0, budget: 6, kernel }).counts), kernel).toEqual([6]);
      const dim1 = countSimplices(k6, { maxDim: 1, kernel });
      expect(Array.from(dim1.counts), kernel).toEqual([6, 15]);
      expect(dim1.truncated, kernel).toBe(true);
      expect(countSimplices(complete(2), { maxDim: 1, kernel }).truncated, kernel).toBe(false);
    }
  });

  it("a budget equal to the number of simplices is enough; one less is not", () => {
    // K5: 5 + 10 + 10 + 5 + 1 = 31 simplices
    const k5 = complete(5);
    expect(Array.from(countSimplices(k5, { budget: 31, kernel: "webassembly" }).counts)).toEqual([
      5, 10, 10, 5, 1,
    ]);
    expect(() => countSimplices(k5, { budget: 30, kernel: "webassembly" })).toThrow(SimplexBudgetError);
    // every simplex counts towards the budget, whichever way it was counted (inline pairs and triples,
    // whole cliques): K5 (31), K8 (2^8 − 1 = 255) and K_{2,2,2,2,2} (3^5 − 1 = 242, no clique shortcut)
    // pass with a budget of exactly their total and stop with one less (common practice: K_n has
    // 2^n − 1 nonempty vertex subsets, all cliques; a cocktail party on 5 pairs has 3^5 − 1: each pair
    // gives none or one of its two vertices)
    for (const kernel of ["webassembly", "typescript"] as const) {
      for (const [g, total] of [
        [complete(5), 31],
        [complete(8), 255],
        [cocktailParty(5), 242],
      ] as const) {
        const counts = countSimplices(g, { budget: total, kernel }).counts;
        expect(
          counts.reduce((a, b) => a + b, 0),
          kernel,
        ).toBe(total);
        expect(() => countSimplices(g, { budget: total - 1, kernel }), kernel).toThrow(SimplexBudgetError);
      }
    }
    // to maxDim 1 the 5 vertices and 10 edges, all counted up front, are checked before any root
    for (const kernel of ["webassembly", "typescript"] as const) {
      expect(Array.from(countSimplices(k5, { maxDim: 1, budget: 15, kernel }).counts), kernel).toEqual([
        5, 10,
      ]);
      expect(() => countSimplices(k5, { maxDim: 1, budget: 14, kernel }), kernel).toThrow(SimplexBudgetError);
    }
  });

  it("a single vertex is past a budget of 0, in a fresh instance and in the kept one", () => {
    // worked by hand: one vertex is one simplex, so a budget of 0 stops before any root, with [1] counted
    // (the TypeScript kernel gives the same); a fresh instance fills its tables in this count
    const one = fromEdgeList({ n: 1, directed: false, sources: [], targets: [], weights: [] });
    for (const fresh of [true, false]) {
      if (fresh) discardKernel();
      for (const kernel of ["webassembly", "typescript"] as const) {
        let error: unknown;
        try {
          countSimplices(one, { budget: 0, kernel });
        } catch (e) {
          error = e;
        }
        expect(error, `${kernel}, fresh ${fresh}`).toBeInstanceOf(SimplexBudgetError);
        expect(Array.from((error as SimplexBudgetError).counted), `${kernel}, fresh ${fresh}`).toEqual([1]);
      }
    }
  });

  it("counts a path on 100 000 vertices in a fresh instance, whose memory then ends with the marks", () => {
    // worked by hand: a path on n vertices has n vertices and n − 1 edges, no triangle. A fresh instance
    // grows its memory to the page after the last region, the marks (4 bytes per vertex): all 400 000
    // bytes of them must fit
    const n = 100_000;
    const path = pathGraph(n);
    discardKernel();
    const r = countSimplices(path, { kernel: "webassembly" });
    expect(Array.from(r.counts)).toEqual([n, n - 1]);
    expect(r.truncated).toBe(false);
  });

  /** A directed star: arcs from vertex 0 to 1 … leaves, and `isolated` more vertices after them. */
  const star = (leaves: number, isolated = 0) =>
    fromEdgeList({
      n: leaves + 1 + isolated,
      directed: true,
      sources: new Array<number>(leaves).fill(0),
      targets: Array.from({ length: leaves }, (_, i) => i + 1),
      weights: new Array<number>(leaves).fill(1),
    });

  it("keeps its instance after a count that fits in 64 MiB and makes a new one after a larger count", () => {
    // countWithWasm keeps the kernel's memory for the next count up to 64 MiB. Worked by hand: the path on
    // 100 000 vertices needs about 1.3 MB of tables (offsets, later neighbours and marks, 4 bytes each, and
    // the fixed tables); a directed star with d arcs out of its hub makes a local universe of d members,
    // rows of ⌈d / 64⌉ 64-bit words, and the rows and the re-packed rows take 2 · d · ⌈d / 64⌉ · 8 bytes:
    // 36.1 MB for d = 12 000 (188 words), 42.4 MB for d = 13 000 (204 words), whose per-level tables at maxDim 1 are 5 levels of 1,024 bytes
    // and of 204 words (as many as 13 004 levels would take another 34.5 MB), and 100.2 MB for d = 20 000
    // (313 words). Counts: n and n − 1 (no triangle), d + 1 and d.
    const n = 100_000;
    const path = pathGraph(n);
    try {
      discardKernel();
      const instance = countKernel();
      expect(Array.from(countSimplices(path, { kernel: "webassembly" }).counts)).toEqual([n, n - 1]);
      expect(countKernel()).toBe(instance);
      // first 12 000 leaves (36.1 MB), so that the next count grows the memory by its difference only
      expect(Array.from(countSimplices(star(12_000), { kernel: "webassembly", maxDim: 1 }).counts)).toEqual([
        12_001, 12_000,
      ]);
      expect(countKernel()).toBe(instance);
      const small = countSimplices(star(13_000), { kernel: "webassembly", maxDim: 1 });
      expect(Array.from(small.counts)).toEqual([13_001, 13_000]);
      expect(small.truncated).toBe(false);
      expect(countKernel()).toBe(instance);
      expect(Array.from(countSimplices(star(20_000), { kernel: "webassembly" }).counts)).toEqual([
        20_001, 20_000,
      ]);
      expect(countKernel()).not.toBe(instance);
    } finally {
      discardKernel();
    }
  });

  it("keeps its instance after a count whose memory is exactly 64 MiB", () => {
    // The bound is inclusive: memory of 1,024 pages is kept. Worked by hand from countWithWasm's layout: a
    // directed star with 16 320 arcs out of its hub (rows of 255 words; the rows and the re-packed rows
    // 2 · 16 320 · 255 · 8 bytes) and 20 000 more isolated vertices (offsets and marks, 8 bytes each) need
    // 67 073 128 bytes, 1,023.45 pages, so a fresh instance grows to 1,024 pages = 64 MiB. The memory size
    // is asserted first, so a change of layout that misses the bound fails here instead of passing.
    const leaves = 16_320;
    const n = leaves + 1 + 20_000;
    const g = star(leaves, 20_000);
    try {
      discardKernel();
      const instance = countKernel();
      expect(Array.from(countSimplices(g, { kernel: "webassembly", maxDim: 1 }).counts)).toEqual([n, leaves]);
      expect(instance?.memory.buffer.byteLength).toBe(64 * 2 ** 20);
      expect(countKernel()).toBe(instance);
    } finally {
      discardKernel();
    }
  });

  it("takes a directed graph's roots in breadth-first order", () => {
    // Worked by hand. Arcs 0 → 2, 2 → 3, 2 → 4, 3 → 4 (the triangle (2, 3, 4), from root 2) and the
    // transitive tournament on 1, 5, 6, 7 (three triangles and a tetrahedron from root 1, a triangle from
    // root 5): 8 vertices, 10 arcs, 5 triangles, 1 tetrahedron; 18 counted up front, 24 in all. A search
    // along out-arcs from vertex 0 reaches 2, 3, 4 before 1, so root 2 comes before root 1: at a budget of
    // 20, root 2 passes (19), root 1 stops the count (23), with 4 triangles counted, and 2 of the 3 roots
    // with two or more out-neighbours (2, 1, 5) finished. Roots in input order would have stopped at root 1
    // with 3 triangles, 1 of 3 finished.
    const arcs: [number, number][] = [
      [0, 2],
      [2, 3],
      [2, 4],
      [3, 4],
      [1, 5],
      [1, 6],
      [1, 7],
      [5, 6],
      [5, 7],
      [6, 7],
    ];
    const g = digraphOf(arcs, 8);
    expect(Array.from(countSimplices(g, { kernel: "webassembly" }).counts)).toEqual([8, 10, 5, 1]);
    let error: unknown;
    try {
      countSimplices(g, { kernel: "webassembly", budget: 20 });
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(SimplexBudgetError);
    expect(Array.from((error as SimplexBudgetError).counted)).toEqual([8, 10, 4, 1]);
    expect((error as SimplexBudgetError).progress).toBeCloseTo(2 / 3, 12);
  });

  it("when the kernel's memory cannot grow, auto counts in TypeScript and webassembly says why it cannot", () => {
    // a fresh instance has less memory than K_130's tables need; make growing fail as it does when the
    // runtime refuses another few hundred MiB (a failed count drops the instance, so stub each fresh one)
    const refuseToGrow = () => {
      discardKernel();
      const memory = countKernel()!.memory as { grow(pages: number): number };
      memory.grow = () => {
        throw new RangeError("WebAssembly.Memory.grow(): Maximum memory size exceeded");
      };
    };
    try {
      const g = complete(130);
      refuseToGrow();
      expect(Array.from(countSimplices(g, { maxDim: 2 }).counts)).toEqual([
        130,
        binomial(130, 2),
        binomial(130, 3),
      ]);
      refuseToGrow();
      expect(() => countSimplices(g, { maxDim: 2, kernel: "webassembly" })).toThrow(
        /WebAssembly counting kernel is not available here, or its memory cannot hold/,
      );
    } finally {
      discardKernel();
    }
  });

  it("reports progress in root vertices, from 0 to n, never before the first root", () => {
    // a report at every check (interval 0): `done` counts roots finished, so 0 ≤ done ≤ n of total n
    for (const kernel of ["webassembly", "typescript"] as const) {
      const done: number[] = [];
      const g = complete(40);
      countSimplices(g, {
        maxDim: 3,
        kernel,
        progressIntervalMs: 0,
        onProgress: (p) => {
          expect(p.total, kernel).toBe(40);
          done.push(p.done);
        },
      });
      expect(done.length, kernel).toBeGreaterThan(1);
      for (const d of done) {
        expect(d, kernel).toBeGreaterThanOrEqual(0);
        expect(d, kernel).toBeLessThanOrEqual(40);
      }
    }
  });

  it("refuses an unknown kernel name", () => {
    // @ts-expect-error: a caller from JavaScript can pass anything
    expect(() => countSimplices(complete(4), { kernel: "wasm" })).toThrow(/kernel must be "auto"/);
  });
});

describe("the WebAssembly kernel against the multipartite closed form, at every cap", () => {
  // A clique of a complete multipartite graph takes at most one vertex from each part (common practice):
  // e_{k+1}(part sizes) k-simplices, once per clique oriented along a total order, (k+1)! times with both
  // arcs (as bitset-counter.test.ts). The cases span one to five 64-bit words per row and reach every
  // dimension, so each region of the kernel's memory (counts, per-level children, packed indices, stack,
  // rows, re-packed rows, marks) holds live data while its neighbours do; each runs first in a fresh
  // instance (memory grown to this graph) and again in the kept one.
  const cases: [number[], Mode][] = [
    [[2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2], "undirected"],
    [[11, 1, 2, 10, 10], "both"],
    [[66, 66, 1, 1, 1], "ordered"],
    [[33, 33, 33], "both"],
    [[70, 70, 70], "undirected"],
    [[100, 100, 100], "undirected"],
    [[100, 100, 100], "ordered"],
    [[1, 2, 3, 4, 5, 6, 7, 8], "ordered"],
  ];
  for (const [sizes, mode] of cases) {
    it(`parts ${sizes.join(", ")}, ${mode}`, () => {
      const g = multipartite(sizes, mode, 23).graph;
      const want = elementary(sizes)
        .slice(1)
        .map((c, k) => (mode === "both" ? c * factorial(k + 1) : c));
      for (const fresh of [true, false]) {
        if (fresh) discardKernel();
        for (let m = 1; m <= want.length; m++) {
          const r = countSimplices(g, { kernel: "webassembly", maxDim: m });
          expect(Array.from(r.counts), `maxDim ${m}, fresh ${fresh}`).toEqual(want.slice(0, m + 1));
          expect(r.truncated, `maxDim ${m}, fresh ${fresh}`).toBe(want.length > m + 1);
        }
        const all = countSimplices(g, { kernel: "webassembly" });
        expect(Array.from(all.counts), `no cap, fresh ${fresh}`).toEqual(want);
      }
    });
  }
});

/** The path 0 – 1 – … – (n − 1), every edge of weight 1. */
function pathGraph(n: number) {
  return fromEdgeList({
    n,
    directed: false,
    sources: Array.from({ length: n - 1 }, (_, i) => i),
    targets: Array.from({ length: n - 1 }, (_, i) => i + 1),
    weights: new Array<number>(n - 1).fill(1),
  });
}

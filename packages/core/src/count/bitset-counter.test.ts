/**
 * The TypeScript counter (bitset-counter.ts) on each of its paths. In mutation runs and wherever the
 * runtime has WebAssembly, `kernel: "auto"` counts in the WebAssembly kernel, so these tests name
 * `kernel: "typescript"`.
 *
 * The reference is a closed form (common practice): a clique of a complete multipartite graph takes at
 * most one vertex from each part, and any such choice is a clique, so with part sizes a_1 … a_r there are
 * e_{k+1}(a_1, …, a_r) k-simplices (e_j: the j-th elementary symmetric polynomial). Oriented along a
 * total order of the vertices, each clique has exactly one admissible vertex order (the order itself), so
 * the directed flag complex has the same counts; with both arcs on every edge, each of the (k+1)! orders
 * is admissible. The vertices are relabelled by a seeded permutation, so parts are spread over the words
 * of the bit rows. Part sizes are chosen so the local universes (lists of later or out-neighbours) span
 * one, two and three to five 32-bit words, and candidate sets of 2, 3, ≤ 32, 32, 33 to 64, 64 and more
 * than 64 members arise (which path each case reaches was read off a copy of the counter with counters
 * in its branches, not committed); each case stays below a million simplices, as mutation runs repeat
 * them for every mutant.
 */
import { describe, expect, it } from "vitest";
import { binomial, factorial } from "../../../../test/support/combinatorics.js";
import { digraphOf } from "../../../../test/support/known-graphs.js";
import { elementary, type Mode, multipartite } from "../../../../test/support/multipartite.js";
import { fromEdgeList } from "../graph/from-edge-list.js";
import type { WeightedGraph } from "../graph/weighted-graph.js";
import { WorkMonitor } from "../work/work-monitor.js";
import { checkLocalSize, countWithBitsets } from "./bitset-counter.js";
import { countSimplices } from "./count-simplices.js";
import type { EnumerationGraph } from "./enumeration-graph.js";
import { SimplexBudgetError } from "./simplex-budget-error.js";

/** k-simplices for k = 0 … r − 1: e_{k+1}(sizes), times (k+1)! with both arcs (see the header). */
function expectedCounts(sizes: number[], mode: Mode): number[] {
  return elementary(sizes)
    .slice(1)
    .map((c, k) => (mode === "both" ? c * factorial(k + 1) : c));
}

const count = (g: WeightedGraph, maxDim?: number, budget?: number) =>
  countSimplices(g, { kernel: "typescript", maxDim, budget });

/** The counts to maxDim (every level below the top level, which is one of 0 … maxDim). */
function checkTo(g: WeightedGraph, want: number[], maxDim: number, label: string): void {
  const got = count(g, maxDim);
  expect(Array.from(got.counts), label).toEqual(want.slice(0, maxDim + 1));
  expect(got.truncated, `${label}: truncated`).toBe(want.length > maxDim + 1);
}

describe("the TypeScript counter against the multipartite closed form, at every cap", () => {
  // [sizes, modes, maxDim]: the largest list of later (undirected) or out- (directed) neighbours, the
  // number of words of a root's bit rows (W), and what is reached, noted beside each
  const cases: [number[], Mode[], number][] = [
    // 18 pairs (lists of 34, two words): children of two and three members settled inline, children in
    // the low word only, across both words, whole cliques in closed form; a cap in every level
    [[2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2], ["undirected", "ordered"], 4],
    // 24 pairs (lists of up to 46, two words, the second holding up to 14 members): sets lying in the
    // second word only, whose children of three or more members hold both vertices of a pair (not a
    // clique: the whole-clique shortcut must not be taken)
    [new Array(24).fill(2), ["undirected"], 4],
    // every dimension: two-word rows with both arcs (no "later members only" shortcut in the rows)
    [[11, 1, 2, 10, 10], ["both"], 5],
    // lists of 121 (four words): candidate sets of 33–64 members packed into two words, of ≤ 32 and of
    // exactly 32 and 64, pairs spread over words, one-word sets in the first and in later words
    [[66, 66, 1, 1, 1], ["ordered"], 5],
    // lists of 66 (three words) with both arcs, to the top
    [[33, 33, 33], ["both"], 3],
    // both arcs, lists of 134: the sets renumbered into a narrower universe have edges inside
    [[66, 66, 1, 1, 1], ["both"], 3],
    // lists of 140 (five words): sets of more than 64 members renumbered into a narrower universe
    [[70, 70, 70], ["undirected", "ordered"], 2],
  ];
  for (const [sizes, modes, maxDim] of cases) {
    for (const mode of modes) {
      it(`parts ${sizes.join(", ")}, ${mode}, maxDim 0 … ${maxDim}`, () => {
        const g = multipartite(sizes, mode, sizes.length * 7 + modes.indexOf(mode)).graph;
        const want = expectedCounts(sizes, mode);
        for (let m = 0; m <= maxDim; m++) checkTo(g, want, m, `maxDim ${m}`);
        // a cap at or above the top dimension still stops the deeper levels short (their "is there a
        // level below" tests); with no cap, every path runs to the end
        if (want.length <= maxDim + 1) {
          const all = count(g);
          expect(Array.from(all.counts), "no cap").toEqual(want);
          expect(all.truncated, "no cap: truncated").toBe(false);
        }
      });
    }
  }
});

describe("every simplex counted towards the budget, on each path", () => {
  // a budget of exactly the total passes, one less stops (the budget counts every simplex, vertices
  // included); totals from the closed form: Π(1 + a_i) − 1 cliques (choose none or one vertex of
  // each part), or Σ_k (k+1)! e_{k+1} with both arcs
  const cases: [number[], Mode][] = [
    [[11, 1, 2, 10, 10], "both"],
    [[2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2], "undirected"],
    [[70, 70, 1, 1], "undirected"],
    [[66, 66, 1, 1, 1], "ordered"],
    [[33, 33, 33], "both"],
    [[2, 3, 60, 60], "undirected"],
    [[2, 3, 60, 60], "ordered"],
  ];
  for (const [sizes, mode] of cases) {
    it(`parts ${sizes.join(", ")}, ${mode}`, () => {
      const g = multipartite(sizes, mode, 99).graph;
      const want = expectedCounts(sizes, mode);
      const total = want.reduce((a, b) => a + b, 0);
      if (mode === "undirected") expect(total).toBe(sizes.reduce((p, a) => p * (1 + a), 1) - 1);
      expect(Array.from(count(g, undefined, total).counts)).toEqual(want);
      expect(() => count(g, undefined, total - 1)).toThrow(SimplexBudgetError);
    });
  }
});

describe("a pair of candidates in a wide set, one of them the universe's first member", () => {
  // Worked by hand. Vertex 0 has arcs to 1 … 69 (a local universe of 69 members, three words; member 0 is
  // vertex 1). Vertex 69 has arcs to 1 and 41 and there is one arc between 1 and 41, so the candidates
  // after (0, 69) are exactly {1, 41}, in two different words. Simplices: 70 vertices; 72 arcs; the
  // triangles (0, 69, 1), (0, 69, 41), (0, 1, 41) or (0, 41, 1), (69, 1, 41) or (69, 41, 1): 4; one
  // 3-simplex, (0, 69, 1, 41) or (0, 69, 41, 1); χ = 70 − 72 + 4 − 1 = 1.
  for (const [a, b] of [
    [1, 41],
    [41, 1],
  ]) {
    it(`with the arc ${a} → ${b}`, () => {
      const sources = [...Array.from({ length: 69 }, () => 0), 69, 69, a];
      const targets = [...Array.from({ length: 69 }, (_, i) => i + 1), 1, 41, b];
      const g = fromEdgeList({ n: 70, directed: true, sources, targets, weights: sources.map(() => 1) });
      const r = countSimplices(g, { kernel: "typescript" });
      expect(Array.from(r.counts)).toEqual([70, 72, 4, 1]);
      expect(r.euler).toBe(1);
    });
  }
});

describe("a cap one below the top, found inside a one-word universe", () => {
  // K4 (undirected) and the transitive tournament on 4 vertices (arcs i → j for i < j) have 4, 6, 4, 1
  // simplices (common practice: every subset is a clique, in one admissible order); at maxDim 2 the
  // tetrahedron is cut off, which only the last level's "is there an edge among the candidates" shows.
  for (const directed of [false, true]) {
    it(directed ? "transitive tournament on 4 vertices" : "K4", () => {
      const sources = [0, 0, 0, 1, 1, 2];
      const targets = [1, 2, 3, 2, 3, 3];
      const g = fromEdgeList({ n: 4, directed, sources, targets, weights: sources.map(() => 1) });
      const r = count(g, 2);
      expect(Array.from(r.counts)).toEqual([4, 6, 4]);
      expect(r.truncated).toBe(true);
      expect(count(g, 3).truncated).toBe(false);
    });
  }
});

describe("a cut seen only in a two- or three-word universe, after a set with no edge inside", () => {
  // Worked by hand. A: vertex 0 has arcs to 1 … 33 (33 members, two words; vertex 33 is member 32, the
  // first of the second word), and 1 → 2, 1 → 3, 2 → 3; 33 → 4, 33 → 5 (no arc between 4 and 5);
  // 6 → 7, 6 → 33, 7 → 33. Arcs: 33 + 3 + 2 + 3 = 41. Triangles from 0: the 8 pairs with an arc among
  // 1 … 33; from 1: (1, 2, 3); from 6: (6, 7, 33): 10. 3-simplices: (0, 1, 2, 3), (0, 6, 7, 33): 2.
  // B: vertex 0 has arcs to 1 … 65 (three words; 65 is member 64), 1 → 2, 1 → 3, 2 → 3, 65 → 4, 65 → 5:
  // 66 vertices, 70 arcs, 6 triangles, one 3-simplex (0, 1, 2, 3).
  // Only vertex 0 has a candidate set with an edge inside, so only its universe can see that maxDim 2
  // cuts something off; its sets are settled from the highest member of the first word down, and the
  // last one checked, {4, 5}, has no edge inside, which must not clear what {2, 3} showed.
  const star = (k: number): [number, number][] => Array.from({ length: k }, (_, i) => [0, i + 1]);
  const a = digraphOf([...star(33), [1, 2], [1, 3], [2, 3], [33, 4], [33, 5], [6, 7], [6, 33], [7, 33]], 34);
  const b = digraphOf([...star(65), [1, 2], [1, 3], [2, 3], [65, 4], [65, 5]], 66);
  it("A, two words", () => {
    expect(Array.from(count(a).counts)).toEqual([34, 41, 10, 2]);
    expect(count(a).euler).toBe(1);
    const cut = count(a, 2);
    expect(Array.from(cut.counts)).toEqual([34, 41, 10]);
    expect(cut.truncated).toBe(true);
  });
  it("C, two words: a pair made of the first members of both words", () => {
    // vertex 0 → 1 … 33; 2 → 1, 2 → 33, 1 → 33: the candidates after (0, 2) are members 0 and 32 (worked
    // by hand: 34 vertices, 36 arcs; triangles (0, 2, 1), (0, 2, 33), (0, 1, 33), (2, 1, 33); one
    // 3-simplex (0, 2, 1, 33))
    const c = digraphOf([...star(33), [2, 1], [2, 33], [1, 33]], 34);
    expect(Array.from(count(c).counts)).toEqual([34, 36, 4, 1]);
  });
  it("B, three words", () => {
    expect(Array.from(count(b).counts)).toEqual([66, 70, 6, 1]);
    const cut = count(b, 2);
    expect(Array.from(cut.counts)).toEqual([66, 70, 6]);
    expect(cut.truncated).toBe(true);
  });
});

describe("three candidates across two words, settled inline, in every orientation", () => {
  // Vertex 0 → 1 … 33 (two words), vertex 1 → 31, 32, 33 (members 30, 31, 32 of 0's universe), and arcs
  // among 31, 32, 33. Transitive (one arc per pair, along an order of the three): 0, 1 and the three form
  // a transitive tournament on 5 vertices, C(5, k+1) simplices (common practice), so with the 29 other
  // vertices and their arcs from 0: 34, 39, 10, 5, 1. Both arcs on each pair (worked by hand): a simplex
  // is 0 and/or 1 in front, then any ordered choice from the three: 34, 29 + 13, 21, 18, 6.
  const orders = [
    [31, 32, 33],
    [31, 33, 32],
    [32, 31, 33],
    [32, 33, 31],
    [33, 31, 32],
    [33, 32, 31],
  ];
  const withArcs = (inner: [number, number][]) => {
    const arcs: [number, number][] = [
      ...Array.from({ length: 33 }, (_, i): [number, number] => [0, i + 1]),
      [1, 31],
      [1, 32],
      [1, 33],
      ...inner,
    ];
    return digraphOf(arcs, 34);
  };
  for (const [s, m, t] of orders) {
    it(`arcs ${s} → ${m}, ${s} → ${t}, ${m} → ${t}`, () => {
      const g = withArcs([
        [s, m],
        [s, t],
        [m, t],
      ]);
      expect(Array.from(count(g).counts)).toEqual([34, 39, 10, 5, 1]);
    });
  }
  it("both arcs on each pair", () => {
    const g = withArcs(orders.map(([a, b]) => [a, b]));
    expect(Array.from(count(g).counts)).toEqual([34, 42, 21, 18, 6]);
  });
});

describe("three candidates in one word, settled inline, in every orientation", () => {
  // As above in a one-word universe: vertex 0 → 1 … 5, vertex 1 → 3, 4, 5, and arcs among 3, 4, 5.
  // Transitive: 0, 1 and the three form a transitive tournament on 5 vertices, C(5, k+1) simplices
  // (common practice), and vertex 2 with its arc from 0: 6, 11, 10, 5, 1. Both arcs on each pair (worked
  // by hand, as above with one extra vertex instead of 29): 6, 5 + 3 + 6 = 14, 21, 18, 6.
  const orders = [
    [3, 4, 5],
    [3, 5, 4],
    [4, 3, 5],
    [4, 5, 3],
    [5, 3, 4],
    [5, 4, 3],
  ];
  const withArcs = (inner: number[][]) => {
    const arcs = [[0, 1], [0, 2], [0, 3], [0, 4], [0, 5], [1, 3], [1, 4], [1, 5], ...inner];
    return digraphOf(arcs, 6);
  };
  for (const [s, m, t] of orders) {
    it(`arcs ${s} → ${m}, ${s} → ${t}, ${m} → ${t}`, () => {
      const g = withArcs([
        [s, m],
        [s, t],
        [m, t],
      ]);
      expect(Array.from(count(g).counts)).toEqual([6, 11, 10, 5, 1]);
    });
  }
  it("both arcs on each pair", () => {
    const g = withArcs(orders.map(([a, b]) => [a, b]));
    expect(Array.from(count(g).counts)).toEqual([6, 14, 21, 18, 6]);
  });
});

describe("a cone over the ordered tripartite graph: sets re-packed twice", () => {
  // The apex has arcs to all 210 vertices (a universe of seven words); its sets of 129–140 members are
  // re-packed into five words, and their sets of 65–70 members must not be re-packed again from there.
  // A cone's simplices are those of the base and, once more, each of them (and the empty one) with the
  // apex in front (common practice): c_k = e_{k+1} + e_k of the part sizes, 211, 14 910, 357 700, 343 000.
  it("counts", () => {
    const g = multipartite([70, 70, 70], "ordered", 5, { apex: true }).graph;
    const e = [1, ...expectedCounts([70, 70, 70], "ordered")];
    const want = [...e.slice(1), 0].map((c, k) => c + e[k]);
    expect(want).toEqual([211, 14_910, 357_700, 343_000]);
    expect(Array.from(count(g).counts)).toEqual(want);
  });
});

describe("a budget passed only by a wide universe's last tally", () => {
  // Worked by hand: vertex 0 → 1 … 66 (three words) and 1 → 2, 3 → 4, …, 65 → 66: every candidate set
  // after 0 has one member, so no deeper level runs, and the triangles (0, 2i − 1, 2i) are tallied at the
  // end of 0's universe. 67 vertices, 99 arcs, 33 triangles: 199 simplices.
  it("199 passes, 198 stops", () => {
    const sources = [
      ...Array.from({ length: 66 }, () => 0),
      ...Array.from({ length: 33 }, (_, i) => 2 * i + 1),
    ];
    const targets = [
      ...Array.from({ length: 66 }, (_, i) => i + 1),
      ...Array.from({ length: 33 }, (_, i) => 2 * i + 2),
    ];
    const g = fromEdgeList({ n: 67, directed: true, sources, targets, weights: sources.map(() => 1) });
    expect(Array.from(count(g, undefined, 199).counts)).toEqual([67, 99, 33]);
    expect(() => count(g, undefined, 198)).toThrow(SimplexBudgetError);
  });
});

describe("a cut found early is kept when later sets have no edge inside", () => {
  // Worked by hand. The transitive tournament on 4 vertices (arcs i → j for i < j) has 4, 6, 4, 1
  // simplices; the digraph r → b, x, y and b → x, y (no arc between x and y) has 4, 5, 2: (r, b, x) and
  // (r, b, y), and from r the candidates after b are {x, y}, two with no arc inside. At maxDim 2 the
  // tournament's 3-simplex is cut off. With a copy of the second digraph before and after the tournament
  // in the input, whichever order the roots come in, such a set is met after the cut has been found.
  it("at maxDim 2", () => {
    const sources: number[] = [];
    const targets: number[] = [];
    const add = (base: number, arcs: [number, number][]) => {
      for (const [a, b] of arcs) {
        sources.push(base + a);
        targets.push(base + b);
      }
    };
    const fork: [number, number][] = [
      [0, 1],
      [0, 2],
      [0, 3],
      [1, 2],
      [1, 3],
    ];
    add(0, fork);
    add(4, [...fork, [2, 3]]); // the tournament: the fork and 2 → 3
    add(8, fork);
    const g = fromEdgeList({ n: 12, directed: true, sources, targets, weights: sources.map(() => 1) });
    const r = count(g, 2);
    expect(Array.from(r.counts)).toEqual([12, 16, 8]);
    expect(r.truncated).toBe(true);
    expect(Array.from(count(g).counts)).toEqual([12, 16, 8, 1]);
  });
});

describe("the empty graph", () => {
  // no vertex, no simplex: no count at all, not a count of 0 vertices (the empty complex, χ = 0; worked by
  // hand), at every cap
  it("has no simplices in the TypeScript counter", () => {
    const empty = fromEdgeList({ n: 0, directed: false, sources: [], targets: [], weights: [] });
    for (const maxDim of [0, 1, 2, undefined]) {
      const r = count(empty, maxDim);
      expect(Array.from(r.counts), `maxDim ${maxDim}`).toEqual([]);
      expect(r.euler, `maxDim ${maxDim}`).toBe(0);
      expect(r.truncated, `maxDim ${maxDim}`).toBe(false);
    }
  });
});

describe("the closed form itself", () => {
  it("equal parts give C(r, k+1)·a^(k+1), as count-simplices.test.ts states it", () => {
    expect(expectedCounts([4, 4, 4], "undirected")).toEqual([1, 2, 3].map((j) => binomial(3, j) * 4 ** j));
  });
});

describe("a local universe too large for its bit matrix is refused before anything is allocated", () => {
  // d vertices need d·⌈d/32⌉ words of 4 bytes; above 2^30 bytes (1 GiB) the counters refuse. Worked by
  // hand: 92 672 vertices (2896 words per row) need 1 073 512 448 bytes, 92 682 (2897 words) 1 073 999 016
  // (2^30 = 1 073 741 824).
  it("the largest allowed and the smallest refused size, and the message", () => {
    expect(() => checkLocalSize(92_672, 2896)).not.toThrow();
    expect(() => checkLocalSize(92_682, 2897)).toThrow(RangeError);
    expect(() => checkLocalSize(92_682, 2897)).toThrow(
      "a local universe of 92682 vertices needs a 1.0 GiB bit matrix; the counter supports local universes " +
        "up to about 90,000 vertices (threshold the graph more strictly)",
    );
  });

  it("a directed star with 92 682 arcs out of one vertex, in both enumerations", () => {
    const arcs = 92_682;
    const star = fromEdgeList({
      n: arcs + 1,
      directed: true,
      sources: new Array<number>(arcs).fill(0),
      targets: Array.from({ length: arcs }, (_, i) => i + 1),
      weights: new Array<number>(arcs).fill(1),
    });
    expect(() => countSimplices(star, { kernel: "typescript" })).toThrow(
      /a local universe of 92682 vertices/,
    );
    expect(() => countSimplices(star, { participation: true })).toThrow(/a local universe of 92682 vertices/);
  });
});

describe("the whole-clique test reads each member's own row in a set lying in one word of a wider universe", () => {
  // Worked by hand. countWithBitsets is called on lists made here (vertex i lists its neighbours above i,
  // ascending: the enumeration graph's contract for an undirected graph, with the identity numbering in
  // place of the degeneracy order, so that the local numbering is known). Vertex 0 is joined to 1 … 33: a
  // universe of 33 members, two words; member i is vertex i + 1. Inside it, members 0, 1, 4, 8, 12 form
  // K5 less the edge 8–12, and member 2 is joined to member 12; the others meet only vertex 0. The
  // candidates after members 0 and 1 are {4, 8, 12}, which is not a clique; rows are word pairs, member
  // b's first word at b × 2, and the words at 4 / 2 and 8 / 2 (the first words of members 1 and 2) do list
  // what lies above 4 and 8 in the set, so reading those would call the set a clique.
  // Counts: the 33 members alone have 33 vertices, 10 edges, 7 triangles (K5's 10 less the 3 through
  // 8–12), 2 tetrahedra ({0, 1, 4, 8}, {0, 1, 4, 12}); vertex 0 cones over them (common practice), so
  // c_k = f_k + f_(k−1): 34, 43, 17, 9, 2.
  const inner: [number, number][] = [
    [0, 1],
    [0, 4],
    [0, 8],
    [0, 12],
    [1, 4],
    [1, 8],
    [1, 12],
    [4, 8],
    [4, 12],
    [2, 12],
  ];
  const edges: [number, number][] = [
    ...Array.from({ length: 33 }, (_, i): [number, number] => [0, i + 1]),
    ...inner.map(([a, b]): [number, number] => [a + 1, b + 1]),
  ];
  const n = 34;
  const later: number[][] = Array.from({ length: n }, () => []);
  for (const [a, b] of edges) later[Math.min(a, b)].push(Math.max(a, b));
  const offsets = new Int32Array(n + 1);
  const targets: number[] = [];
  for (let v = 0; v < n; v++) {
    targets.push(...later[v].sort((a, b) => a - b));
    offsets[v + 1] = targets.length;
  }
  const g: EnumerationGraph = {
    n,
    directed: false,
    offsets,
    targets: Int32Array.from(targets),
    slots: Int32Array.from(targets, (_, i) => i),
    vertexOf: Int32Array.from({ length: n }, (_, v) => v),
    maxList: Math.max(...later.map((l) => l.length)),
  };
  it("at maxDim 4 and with no cap", () => {
    for (const maxDim of [4, 8]) {
      const r = countWithBitsets(g, maxDim, Number.POSITIVE_INFINITY, new WorkMonitor(undefined));
      expect(Array.from(r.counts), `maxDim ${maxDim}`).toEqual([34, 43, 17, 9, 2]);
      expect(r.truncated, `maxDim ${maxDim}`).toBe(false);
    }
    // the same graph through countSimplices (degeneracy numbering): the same counts
    const viaGraph = fromEdgeList({
      n,
      directed: false,
      sources: edges.map((e) => e[0]),
      targets: edges.map((e) => e[1]),
      weights: edges.map(() => 1),
    });
    expect(Array.from(count(viaGraph).counts)).toEqual([34, 43, 17, 9, 2]);
  });
});

describe("the clock is read once every 256 roots", () => {
  // Worked by hand. The circulant digraph v → v + 1, v + 2 (mod 1,024): every root has two out-neighbours
  // and one triangle (v, v + 1, v + 2), 4,096 simplices in all, far below the 2^20 between two checkpoint
  // checks. With a report at every reading of the clock (interval 0), the count reports done = 0 when it
  // begins and at its first checkpoint (vertices and arcs, counted up front), then once every 256 roots
  // (0, 256, 512, 768), as the WebAssembly kernel does between its calls of 256 roots.
  const n = 1024;
  const sources = Array.from({ length: 2 * n }, (_, i) => i >> 1);
  const targets = sources.map((v, i) => (v + 1 + (i & 1)) % n);
  const g = fromEdgeList({ n, directed: true, sources, targets, weights: sources.map(() => 1) });
  it.each(["typescript", "webassembly"] as const)("%s kernel", (kernel) => {
    const done: number[] = [];
    const r = countSimplices(g, { kernel, progressIntervalMs: 0, onProgress: (p) => done.push(p.done) });
    expect(Array.from(r.counts)).toEqual([n, 2 * n, n]);
    expect(done).toEqual([0, 0, 0, 256, 512, 768]);
  });
});

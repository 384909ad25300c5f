/**
 * The annotated enumeration (annotated-enumerator.ts: participation, and the sweep's threshold bins) on
 * complete multipartite graphs, entry by entry against closed forms (common practice; the same reasoning
 * as bitset-counter.test.ts): a clique takes at most one vertex from each part, so with part sizes
 * a_1 … a_r there are e_{k+1}(a) k-simplices (e_j: the j-th elementary symmetric polynomial);
 * - a vertex v of part p lies in e_k(a without a_p) k-simplices (it is one of the k + 1 vertices, the other
 *   k come from k other parts), an edge between parts p and q in e_{k−1}(a without a_p, a_q);
 * - oriented along a total order ("ordered"), each clique is one directed simplex, its vertices in that
 *   order: v is its source in e_k over the other parts of the number of vertices after v, its sink in
 *   e_k of those before v;
 * - with both arcs ("both"), all (k+1)! orders are simplices: v is in (k+1)!·e_k(…), first in k!·e_k(…) of
 *   them and last in as many; the arc u→v is in those orders with u before v, half of them;
 * - threshold bins: an edge between parts p < q gets weight q (or p), so at threshold t the graph is the
 *   complete multipartite graph on the parts below t (plus isolated vertices), or that graph joined to
 *   every vertex of the parts from t on, which are pairwise not adjacent: e_{k+1}(a_0..a_{t−1}) +
 *   e_k(a_0..a_{t−1})·(a_t + … + a_{r−1}).
 * Part sizes put local universes in one, two and three words of the bit rows; vertices are relabelled by
 * a seeded permutation.
 */
import { describe, expect, it } from "vitest";
import { factorial } from "../../../../test/support/combinatorics.js";
import { significant } from "../../../../test/support/graph-ops.js";
import { completeGraph, digraphOf } from "../../../../test/support/known-graphs.js";
import {
  elementary,
  type Mode,
  type Multipartite,
  multipartite,
} from "../../../../test/support/multipartite.js";
import { missingPythonModules, runPythonScript } from "../../../../test/support/python.js";
import { seededRandom } from "../../../../test/support/random.js";
import { explicitGrid } from "../filtration/threshold-grid.js";
import { fromEdgeList } from "../graph/from-edge-list.js";
import { countSimplices } from "./count-simplices.js";
import { SimplexBudgetError } from "./simplex-budget-error.js";
import { sweepSimplexCounts } from "./sweep-simplex-counts.js";

const at = (e: number[], j: number) => (j >= 0 && j < e.length ? e[j] : 0);

/** e_j of the part sizes without the parts listed. */
function without(sizes: number[], ...parts: number[]): number[] {
  return elementary(sizes.filter((_, i) => !parts.includes(i)));
}

function checkParticipation(m: Multipartite, mode: Mode): void {
  const { graph, sizes, part, rank } = m;
  const r = countSimplices(graph, { participation: true, edgeParticipation: true });
  const top = sizes.length - 1;
  const orders = (k: number) => (mode === "both" ? factorial(k + 1) : 1);
  expect(Array.from(r.counts)).toEqual(
    elementary(sizes)
      .slice(1)
      .map((c, k) => c * orders(k)),
  );
  const p = r.participation!;
  expect(p.member.length).toBe(top + 1);
  // expected rows, compared whole (one assertion per row)
  const member = Array.from({ length: top + 1 }, () => new Array<number>(graph.n).fill(0));
  const source = member.map((row) => row.slice());
  const sink = member.map((row) => row.slice());
  for (let v = 0; v < graph.n; v++) {
    const others = without(sizes, part[v]);
    // ordered: vertices of the other parts after (before) v in the total order
    const after: number[] = new Array(sizes.length).fill(0);
    const before: number[] = new Array(sizes.length).fill(0);
    for (let u = 0; u < graph.n; u++) {
      if (part[u] === part[v]) continue;
      if (rank[u] > rank[v]) after[part[u]]++;
      else before[part[u]]++;
    }
    const afterE = elementary(after);
    const beforeE = elementary(before);
    for (let k = 0; k <= top; k++) {
      member[k][v] = at(others, k) * orders(k);
      source[k][v] = mode === "both" ? at(others, k) * factorial(k) : at(afterE, k);
      sink[k][v] = mode === "both" ? at(others, k) * factorial(k) : at(beforeE, k);
    }
  }
  expect(
    p.member.map((row) => Array.from(row)),
    "member",
  ).toEqual(member);
  if (mode === "undirected") expect(p.source).toBeUndefined();
  else {
    expect(
      p.source!.map((row) => Array.from(row)),
      "source",
    ).toEqual(source);
    expect(
      p.sink!.map((row) => Array.from(row)),
      "sink",
    ).toEqual(sink);
  }
  const edges = Array.from({ length: top + 1 }, () => new Array<number>(graph.targets.length).fill(0));
  for (let u = 0; u < graph.n; u++) {
    for (let s = graph.offsets[u]; s < graph.offsets[u + 1]; s++) {
      const rest = without(sizes, part[u], part[graph.targets[s]]);
      for (let k = 1; k <= top; k++)
        edges[k][s] = at(rest, k - 1) * (mode === "both" ? factorial(k + 1) / 2 : 1);
    }
  }
  expect(
    r.edgeParticipation!.map((row) => Array.from(row)),
    "edges",
  ).toEqual(edges);
}

describe("node and edge participation against the multipartite closed forms", () => {
  // [sizes, modes]: largest local universe (later or out-neighbours) beside each
  const cases: [number[], Mode[]][] = [
    [
      [1, 2, 3, 4, 5],
      ["undirected", "ordered", "both"],
    ], // one word
    [
      [2, 3, 4, 6, 7, 9, 11],
      ["undirected", "ordered"],
    ], // 30–40: one and two words
    [
      [20, 20, 20],
      ["undirected", "ordered", "both"],
    ], // 40: two words
    [
      [1, 36, 36],
      ["undirected", "ordered"],
    ], // 72: three words
    [new Array(13).fill(1), ["undirected", "ordered"]], // K_13: 12; the first root's path of snapshots (12 + 11 + … + 1 = 78 entries) outgrows the
    // snapshot stack's first size, 4·(12 + 2) = 56 (worked by hand)
  ];
  for (const [sizes, modes] of cases) {
    for (const mode of modes) {
      it(`parts ${sizes.join(", ")}, ${mode}`, () => {
        checkParticipation(multipartite(sizes, mode, 5 + sizes.length), mode);
      });
    }
  }
});

/** Counts at threshold t (1 … r) of the two weightings in the header, k = 0 … r − 1. */
function sweepExpected(sizes: number[], t: number, joinedToLater: boolean, mode: Mode): number[] {
  const n = sizes.reduce((a, b) => a + b, 0);
  const e = elementary(sizes.slice(0, t));
  const later = sizes.slice(t).reduce((a, b) => a + b, 0);
  return sizes.map((_, k) => {
    if (k === 0) return n;
    const cliques = at(e, k + 1) + (joinedToLater ? at(e, k) * later : 0);
    return cliques * (mode === "both" ? factorial(k + 1) : 1);
  });
}

describe("the sweep's threshold bins against the multipartite closed forms", () => {
  const cases: [number[], Mode[]][] = [
    [
      [1, 2, 3, 4, 5, 6],
      ["undirected", "ordered", "both"],
    ],
    [
      [3, 5, 7, 9, 11, 13],
      ["undirected", "ordered"],
    ], // lists up to 45: two words
    [
      [2, 3, 33, 34],
      ["undirected", "ordered"],
    ], // up to 72: three words
  ];
  for (const [sizes, modes] of cases) {
    for (const mode of modes) {
      for (const joinedToLater of [false, true]) {
        it(`parts ${sizes.join(", ")}, ${mode}, weight ${joinedToLater ? "min" : "max"}(p, q) + 1`, () => {
          const weight = (p: number, q: number) => (joinedToLater ? p : q) + 1;
          const { graph } = multipartite(sizes, mode, 11, { weight });
          const r = sizes.length;
          const thresholds = Array.from({ length: r }, (_, t) => t + 1);
          const sweep = sweepSimplexCounts(graph, explicitGrid(thresholds, "distance"), {
            kernel: "typescript",
          });
          for (let t = 1; t <= r; t++) {
            const want = sweepExpected(sizes, t, joinedToLater, mode);
            expect(Array.from(sweep.counts[t - 1]), `threshold ${t}`).toEqual(want);
            const chi = want.reduce((s, c, k) => s + (k % 2 === 0 ? c : -c), 0);
            expect(sweep.euler[t - 1], `χ at ${t}`).toBe(chi);
          }
          expect(sweep.truncated).toBe(false);
          // capped: the counts up to the cap, and the cut reported; a cap at the top dimension, r − 1,
          // cuts nothing (two candidates without an edge between them at the last level are no cut)
          for (let cap = 1; cap <= r - 1; cap++) {
            const capped = sweepSimplexCounts(graph, explicitGrid(thresholds, "distance"), {
              kernel: "typescript",
              maxDim: cap,
            });
            expect(
              capped.counts.map((row) => Array.from(row)),
              `maxDim ${cap}`,
            ).toEqual(thresholds.map((t) => sweepExpected(sizes, t, joinedToLater, mode).slice(0, cap + 1)));
            expect(capped.truncated, `maxDim ${cap}`).toBe(cap < r - 1);
          }
        });
      }
    }
  }
});

describe("the sweep's bins in candidate sets of more than 32 members", () => {
  // K_40 as 40 parts of one vertex, weight min(p, q) + 1 (the "min" weighting of the header, so the same
  // closed form). The first roots of the degeneracy order have 39 or so vertices in their local universe
  // (two words); a first candidate early in that list leaves more than 32 candidates over both words, which
  // the sweep enumerates in the general routine below the root. There a simplex's bin is the larger of its
  // path's bin and the candidate's carried bin: a triangle {r, a, j} with j's label below r's and a's
  // enters at min(r, a) + 1, from the edge r–a that j's carried bin does not see.
  const sizes = new Array<number>(40).fill(1);
  for (const mode of ["undirected", "ordered"] as Mode[]) {
    for (const cap of [2, 3]) {
      it(`K_40, ${mode}, maxDim ${cap}`, () => {
        const weight = (p: number) => p + 1;
        const { graph } = multipartite(sizes, mode, 17, { weight });
        const thresholds = Array.from({ length: sizes.length }, (_, t) => t + 1);
        const sweep = sweepSimplexCounts(graph, explicitGrid(thresholds, "distance"), {
          kernel: "typescript",
          maxDim: cap,
        });
        expect(sweep.counts.map((row) => Array.from(row))).toEqual(
          thresholds.map((t) => sweepExpected(sizes, t, true, mode).slice(0, cap + 1)),
        );
        expect(sweep.truncated).toBe(true);
      });
    }
  }
});

const missingNetworkx = missingPythonModules(["networkx"]);

describe.skipIf(missingNetworkx !== null)(
  `the sweep on directed hubs against networkx${missingNetworkx ? ` (skipped: ${missingNetworkx})` : ""}`,
  () => {
    // A hub with arcs to 40 vertices, its local universe of two words: 32 vertices with no other arc, and
    // 8 with seeded random arcs among them (p = 0.5 each way). Those 8 have more neighbours, so they come
    // after the 32 in the degeneracy numbering and fill the second word: their candidate sets lie in one
    // word that is not the first, some with two candidates, with and without arcs between them. Weights in
    // tenths. Counts per threshold from networkx (networkx.enumerate_all_cliques and the admissible vertex
    // orders of each clique, test/support/python/clique_counts.py).
    for (const seed of [1, 2, 3]) {
      it(`seed ${seed}`, () => {
        const random = seededRandom(900 + seed);
        const edges: [number, number, number][] = [];
        const tenth = () => Math.ceil(random() * 10) / 10;
        for (let v = 1; v <= 40; v++) edges.push([0, v, tenth()]);
        for (let u = 33; u <= 40; u++)
          for (let v = 33; v <= 40; v++) if (u !== v && random() < 0.5) edges.push([u, v, tenth()]);
        const thresholds = [0.2, 0.4, 0.6, 0.8, 1];
        const reference = runPythonScript<{ perThreshold: number[][] }>("clique_counts.py", {
          graph: "edges",
          n: 41,
          directed: true,
          edges,
          thresholds,
          semantics: "distance",
        });
        const graph = fromEdgeList({
          n: 41,
          directed: true,
          sources: edges.map((e) => e[0]),
          targets: edges.map((e) => e[1]),
          weights: edges.map((e) => e[2]),
        });
        const sweep = sweepSimplexCounts(graph, explicitGrid(thresholds, "distance"), {
          kernel: "typescript",
        });
        thresholds.forEach((t, i) => {
          expect(significant(sweep.counts[i]), `threshold ${t}`).toEqual(reference.perThreshold[i]);
        });
      });
    }
  },
);

describe("every simplex of the annotated enumeration counts towards the budget", () => {
  for (const [sizes, mode] of [
    [[1, 2, 3, 4, 5], "undirected"],
    [[20, 20, 20], "ordered"],
    [[2, 3, 33, 34], "undirected"],
    [[3, 4, 5], "both"],
    // K4 and the transitive tournament on 4 vertices: the first root's first candidate leaves two
    // candidates joined by an edge, settled inline in the one-word routine (15 simplices)
    [[1, 1, 1, 1], "undirected"],
    [[1, 1, 1, 1], "ordered"],
  ] as [number[], Mode][]) {
    it(`parts ${sizes.join(", ")}, ${mode}: a budget of the total passes, one less stops`, () => {
      const { graph } = multipartite(sizes, mode, 3);
      const want = elementary(sizes)
        .slice(1)
        .map((c, k) => c * (mode === "both" ? factorial(k + 1) : 1));
      const total = want.reduce((a, b) => a + b, 0);
      for (const participation of [true, false]) {
        const sweep = (budget: number) =>
          participation
            ? countSimplices(graph, { participation, budget }).counts
            : sweepSimplexCounts(graph, explicitGrid([1], "distance"), { kernel: "typescript", budget })
                .counts[0];
        expect(Array.from(sweep(total)), `participation ${participation}`).toEqual(want);
        expect(() => sweep(total - 1), `participation ${participation}`).toThrow(SimplexBudgetError);
      }
    });
  }
});

describe("per-edge annotations are refused above 2^28 entries of the local edge tables", () => {
  // d local vertices need d² entries per table (bin and slot of each local edge); the bound is
  // d² ≤ 2^28, d ≤ 16 384 (worked by hand). A directed star's hub has all its out-arcs in one local
  // universe; no two leaves are joined, so the tables stay untouched and cost no memory. maxDim 1: the
  // participation rows are made up front for every dimension the hub could reach (16 385 rows of n).
  const star = (arcs: number) =>
    fromEdgeList({
      n: arcs + 1,
      directed: true,
      sources: new Array<number>(arcs).fill(0),
      targets: Array.from({ length: arcs }, (_, i) => i + 1),
      weights: new Array<number>(arcs).fill(1),
    });
  const message = "a local universe of 16385 vertices is too large for per-edge annotations";

  it("16 385 arcs out of one vertex: edge participation and the sweep's bins refuse, node participation does not", () => {
    const g = star(16_385);
    expect(() => countSimplices(g, { edgeParticipation: true, maxDim: 1 })).toThrow(new RangeError(message));
    const grid = explicitGrid([1], "distance");
    expect(() => sweepSimplexCounts(g, grid, { kernel: "typescript", maxDim: 1 })).toThrow(
      new RangeError(message),
    );
    // no per-edge table: vertices and arcs counted, each leaf in one edge, the hub in all
    const r = countSimplices(g, { participation: true, maxDim: 1 });
    expect(Array.from(r.counts)).toEqual([16_386, 16_385]);
    expect(r.participation!.member[1][0]).toBe(16_385);
  });

  it("16 384 arcs, the largest allowed: counted, with every arc in one edge", () => {
    const g = star(16_384);
    const r = countSimplices(g, { edgeParticipation: true, maxDim: 1 });
    expect(Array.from(r.counts)).toEqual([16_385, 16_384]);
    expect(r.edgeParticipation![1].every((x) => x === 1)).toBe(true);
    const sweep = sweepSimplexCounts(g, explicitGrid([1], "distance"), {
      kernel: "typescript",
      maxDim: 1,
    });
    expect(Array.from(sweep.counts[0])).toEqual([16_385, 16_384]);
  });
});

describe("progress of the annotated enumeration", () => {
  // A report at every check (interval 0): `done` counts roots finished, so it never decreases and stays
  // within 0 … n of total n. A path on 600 vertices: every root but the last has one later neighbour
  // (worked by hand: peeling a path removes an end with one neighbour left, until one vertex is left), so
  // the roots past 256 that the root loop checks the clock at have work.
  it("is reported in root vertices, from 0 to n, never decreasing, for participation and the sweep", () => {
    const n = 600;
    const graph = fromEdgeList({
      n,
      directed: false,
      sources: Array.from({ length: n - 1 }, (_, i) => i),
      targets: Array.from({ length: n - 1 }, (_, i) => i + 1),
      weights: new Array<number>(n - 1).fill(1),
    });
    const runs: [string, (onProgress: (p: { done: number; total: number }) => void) => void][] = [
      [
        "participation",
        (onProgress) =>
          countSimplices(graph, { participation: true, maxDim: 1, progressIntervalMs: 0, onProgress }),
      ],
      [
        "sweep",
        (onProgress) =>
          sweepSimplexCounts(graph, explicitGrid([1], "distance"), {
            kernel: "typescript",
            maxDim: 1,
            progressIntervalMs: 0,
            onProgress,
          }),
      ],
    ];
    for (const [label, run] of runs) {
      const done: number[] = [];
      run((p) => {
        expect(p.total, label).toBe(n);
        done.push(p.done);
      });
      expect(done[0], label).toBe(0);
      expect(Math.max(...done), label).toBeGreaterThanOrEqual(256);
      for (let i = 0; i < done.length; i++) {
        expect(done[i], label).toBeLessThanOrEqual(n);
        if (i > 0) expect(done[i], label).toBeGreaterThanOrEqual(done[i - 1]);
      }
    }
  });
});

describe("the empty graph", () => {
  // no vertex, no simplex: every table is empty (the empty complex; χ = 0)
  it("has no simplices, no participation rows and no sweep rows", () => {
    const empty = fromEdgeList({ n: 0, directed: false, sources: [], targets: [], weights: [] });
    const r = countSimplices(empty, { participation: true, edgeParticipation: true });
    expect(Array.from(r.counts)).toEqual([]);
    expect(r.euler).toBe(0);
    expect(r.participation!.member).toEqual([]);
    expect(r.edgeParticipation).toEqual([]);
    const sweep = sweepSimplexCounts(empty, explicitGrid([1, 2], "distance"), { kernel: "typescript" });
    expect(sweep.counts.map((row) => Array.from(row))).toEqual([[], []]);
  });
});

describe("a budget that runs out inside a packed candidate set of the first root", () => {
  // K_34 in the sweep (all edges at threshold 1): the first root of the degeneracy order has the other
  // 33 vertices as its local universe, two words. Worked by hand, candidates taken from the highest local
  // index down: 31 (one later member, 32: one triangle, counted in the one-word routine), 30 (two: two
  // triangles and a tetrahedron, settled inline), 29 (three, across both words: the packed routine, three
  // triangles, three tetrahedra, one 4-simplex). With the 34 vertices, 1 + 3 + 7 = 11 more make 45, past a
  // budget of 44 at the end of the packed routine, where no root is finished yet (the first root's edges
  // are added when its top level ends).
  it("stops with no root done and the simplices so far", () => {
    const g = completeGraph(34);
    let error: unknown;
    try {
      sweepSimplexCounts(g, explicitGrid([1], "distance"), { kernel: "typescript", budget: 44 });
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(SimplexBudgetError);
    const err = error as SimplexBudgetError;
    expect(err.progress).toBe(0);
    expect(Array.from(err.counted)).toEqual([34, 0, 6, 4, 1]);
  });
});

describe("a cut seen only at a joined pair of a packed candidate set", () => {
  // Worked by hand. Arcs 0 → 1 … 40 (vertex 0's local universe: 40 members, two words; member m is vertex
  // m + 1, directed lists keep the input numbering) and the transitive tournament on 1, 2, 3, 34 (i → j for
  // i < j). After the first member (vertex 1) the candidates are vertices 2, 3, 34, three over both words:
  // the packed routine; in it, after vertex 2 the two candidates 3 and 34 have the arc 3 → 34, which makes
  // (0, 1, 2, 3, 34), the only 4-simplex (the tournament on 0, 1, 2, 3, 34: C(5, k+1) simplices, common
  // practice, with 36 more vertices and their arcs from 0): 41, 46, 10, 5, 1. At maxDim 3 only that pair
  // shows the cut.
  const arcs: [number, number][] = [
    ...Array.from({ length: 40 }, (_, i): [number, number] => [0, i + 1]),
    [1, 2],
    [1, 3],
    [1, 34],
    [2, 3],
    [2, 34],
    [3, 34],
  ];
  const g = digraphOf(arcs, 41);
  const sweep = (maxDim: number) =>
    sweepSimplexCounts(g, explicitGrid([1], "distance"), { kernel: "typescript", maxDim });
  it("in the sweep at maxDim 3 and 4", () => {
    const cut = sweep(3);
    expect(Array.from(cut.counts[0])).toEqual([41, 46, 10, 5]);
    expect(cut.truncated).toBe(true);
    const all = sweep(4);
    expect(Array.from(all.counts[0])).toEqual([41, 46, 10, 5, 1]);
    expect(all.truncated).toBe(false);
  });
});

describe("a budget below the number of vertices", () => {
  // the vertices are counted up front: with fewer simplices allowed than vertices, the count stops before
  // any root, even when nothing else would be counted (maxDim 0, or no edges) — worked by hand. Progress
  // is the share of roots with work that were finished: none of K4's three, and 1 (the count is complete)
  // where no root has work (rootProgress in simplex-budget-error.ts).
  it("stops before the first root, with the vertices counted", () => {
    const k4 = completeGraph(4);
    const isolated = fromEdgeList({ n: 4, directed: false, sources: [], targets: [], weights: [] });
    const runs: [string, () => unknown, number][] = [
      ["K4, participation", () => countSimplices(k4, { participation: true, budget: 3 }), 0],
      [
        "K4, participation, maxDim 0",
        () => countSimplices(k4, { participation: true, budget: 3, maxDim: 0 }),
        0,
      ],
      ["no edges, participation", () => countSimplices(isolated, { participation: true, budget: 3 }), 1],
      [
        "no edges, sweep",
        () =>
          sweepSimplexCounts(isolated, explicitGrid([1], "distance"), { kernel: "typescript", budget: 3 }),
        1,
      ],
    ];
    for (const [label, run, progress] of runs) {
      let error: unknown;
      try {
        run();
      } catch (e) {
        error = e;
      }
      expect(error, label).toBeInstanceOf(SimplexBudgetError);
      expect(Array.from((error as SimplexBudgetError).counted), label).toEqual([4]);
      expect((error as SimplexBudgetError).progress, label).toBe(progress);
    }
  });

  it("passes with a budget of exactly the number of vertices when there is nothing else", () => {
    // four isolated vertices are four simplices, checked against the budget before any root: 4 is enough
    // (worked by hand)
    const isolated = fromEdgeList({ n: 4, directed: false, sources: [], targets: [], weights: [] });
    expect(Array.from(countSimplices(isolated, { participation: true, budget: 4 }).counts)).toEqual([4]);
    const sweep = sweepSimplexCounts(isolated, explicitGrid([1], "distance"), {
      kernel: "typescript",
      budget: 4,
    });
    expect(Array.from(sweep.counts[0])).toEqual([4]);
  });
});

describe("participation rows of a hub", () => {
  it("a directed star of 8,193 leaves keeps rows for the edges only", () => {
    // Worked by hand: the hub is in every edge and is its source; each leaf is in one edge, as its sink.
    // Rows used to be made for every dimension the hub's 8,193 out-neighbours could reach: 3 × 8,194 rows
    // of 8,194 doubles (1.6 GB), held by the module after the count.
    const d = 8193;
    const sources = new Array<number>(d).fill(0);
    const targets = Array.from({ length: d }, (_, i) => i + 1);
    const graph = fromEdgeList({ n: d + 1, sources, targets, weights: sources.map(() => 1), directed: true });
    const before = process.memoryUsage().arrayBuffers;
    const r = countSimplices(graph, { participation: true });
    const grown = process.memoryUsage().arrayBuffers - before;
    expect(Array.from(r.counts)).toEqual([d + 1, d]);
    const p = r.participation!;
    expect(p.member.length).toBe(2);
    expect([p.member[1][0], p.source![1][0], p.sink![1][0]]).toEqual([d, d, 0]);
    expect(new Set(p.member[1].subarray(1))).toEqual(new Set([1]));
    expect(new Set(p.sink![1].subarray(1))).toEqual(new Set([1]));
    expect(grown).toBeLessThan(256 * 2 ** 20);
  });
});

import { describe, expect, it } from "vitest";
import { errorOf } from "../../../../test/support/error-of.js";
import { NotingMonitor } from "../../../../test/support/noting-monitor.js";
import { type RandomArcs, randomArcs } from "../../../../test/support/random-arcs.js";
import { SimplexBudgetError } from "../count/simplex-budget-error.js";
import { edgeFiltration } from "../filtration/edge-filtration.js";
import { fromEdgeList } from "../graph/from-edge-list.js";
import type { WeightedGraph } from "../graph/weighted-graph.js";
import { WorkMonitor } from "../work/work-monitor.js";
import { DirectedFlagTables } from "./directed-flag-tables.js";
import { ByteLedger, HomologyBudgetError } from "./homology-budget.js";
import { SimplexQuota } from "./simplex-quota.js";

/**
 * The tables are checked against the definition of the directed flag complex (a k-simplex is a tuple of
 * distinct vertices v0 … vk with an arc vi → vj for every i < j, entering at the largest value of those
 * arcs: "Cliques of neurons bound into cavities provide a missing link between structure and function",
 * Frontiers in Computational Neuroscience, 2017), listed here by brute force over all tuples, and against
 * the simplicial coboundary: σ has coefficient (−1)^i in δ of every coface whose i-th facet it is (the
 * boundary formula of Hatcher, "Algebraic Topology", 2002, §2.1, transposed).
 */

type Arcs = Omit<RandomArcs, "directed">;

const graphOf = (arcs: Arcs): WeightedGraph => fromEdgeList({ ...arcs, directed: true });

interface Simplex {
  tuple: number[];
  f: number;
}

/** Every simplex of dimension 0 … top by brute force, each dimension sorted by (f, tuple lexicographically). */
function bruteForce(arcs: Arcs, top: number): Simplex[][] {
  const arc = new Map<number, number>();
  for (let e = 0; e < arcs.sources.length; e++)
    arc.set(arcs.sources[e] * arcs.n + arcs.targets[e], arcs.weights[e]);
  const dims: Simplex[][] = Array.from({ length: top + 1 }, () => []);
  const grow = (tuple: number[], f: number) => {
    dims[tuple.length - 1].push({ tuple: [...tuple], f });
    if (tuple.length - 1 === top) return;
    for (let w = 0; w < arcs.n; w++) {
      if (tuple.includes(w)) continue;
      let g = f;
      let ok = true;
      for (const v of tuple) {
        const value = arc.get(v * arcs.n + w);
        if (value === undefined) ok = false;
        else g = Math.max(g, value);
      }
      if (ok) grow([...tuple, w], g);
    }
  };
  for (let v = 0; v < arcs.n; v++) grow([v], Number.NEGATIVE_INFINITY);
  const lexicographic = (a: number[], b: number[]) => {
    for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return a[i] - b[i];
    return 0;
  };
  for (const list of dims) list.sort((a, b) => (a.f !== b.f ? a.f - b.f : lexicographic(a.tuple, b.tuple)));
  return dims;
}

function build(graph: WeightedGraph, top: number, maxSimplices?: number, maxBytes?: number) {
  return buildWith(
    new ByteLedger(maxBytes === undefined ? undefined : { maxBytes }),
    graph,
    top,
    maxSimplices,
  );
}

function buildWith(ledger: ByteLedger, graph: WeightedGraph, top: number, maxSimplices?: number) {
  const quota = new SimplexQuota(maxSimplices, top);
  return new DirectedFlagTables(
    graph,
    edgeFiltration(graph, "distance"),
    top,
    ledger,
    new WorkMonitor({}),
    quota,
  );
}

/** The tuple of every simplex of the tables, in key order. */
function tuplesOf(tables: DirectedFlagTables, dim: number, count: number): number[][] {
  const out = new Int32Array(dim + 1);
  const tuples: number[][] = [];
  for (let key = 0; key < count; key++) {
    tables.vertices(dim, key, out);
    tuples.push(Array.from(out));
  }
  return tuples;
}

/** Facets of a tuple, dropping vertex 0, 1, … in turn. */
const facetsOf = (tuple: number[]) => tuple.map((_, i) => tuple.filter((_, j) => j !== i));

const mod = (x: number, p: number) => ((x % p) + p) % p;

const cases = [
  { n: 5, p: 0.7, levels: 3, seed: 101, top: 3 },
  { n: 6, p: 0.6, levels: 4, seed: 102, top: 3 },
  { n: 7, p: 0.5, levels: 2, seed: 103, top: 4 },
  { n: 6, p: 0.8, levels: 1, seed: 104, top: 2 },
  { n: 8, p: 0.45, levels: 6, seed: 105, top: 3 },
  // Every arc in both directions: the complete digraph, whose k-simplices are the n!/(n−k−1)! tuples.
  { n: 5, p: 1, levels: 5, seed: 106, top: 4 },
];

describe("DirectedFlagTables", () => {
  for (const c of cases) {
    const arcs = randomArcs(c.n, c.p, c.levels, c.seed, true);
    const graph = graphOf(arcs);
    const label = `n=${c.n} p=${c.p} seed=${c.seed}, dimensions 0 … ${c.top}`;

    it(`lists every simplex in (f, tuple) order, keys being positions (${label})`, () => {
      const expected = bruteForce(arcs, c.top);
      const tables = build(graph, c.top);
      expect(tables.vertexCount).toBe(c.n);
      expect(tables.counts()).toEqual(expected.map((list) => list.length));
      for (let dim = 0; dim <= c.top; dim++) {
        const list = tables.listSimplices(dim);
        expect(list.count).toBe(expected[dim].length);
        expect(Array.from(list.key)).toEqual(expected[dim].map((_, i) => i));
        expect(Array.from(list.f)).toEqual(expected[dim].map((s) => s.f));
        expect(tuplesOf(tables, dim, list.count)).toEqual(expected[dim].map((s) => s.tuple));
      }
    });

    it(`pushes factor · δσ with coefficients (−1)^i mod p, and finds zero cofaces and facets (${label})`, () => {
      const expected = bruteForce(arcs, c.top);
      const tables = build(graph, c.top);
      const keyOf = expected.map((list) => new Map(list.map((s, i) => [s.tuple.join(","), i])));
      for (let dim = 0; dim < c.top; dim++) {
        // The coboundary of every simplex of this dimension, from the cofaces' facets.
        const rows: [number, number, number][][] = expected[dim].map(() => []);
        expected[dim + 1].forEach((coface, key) => {
          facetsOf(coface.tuple).forEach((facet, i) => {
            rows[keyOf[dim].get(facet.join(",")) as number].push([coface.f, key, i % 2 === 0 ? 1 : -1]);
          });
        });
        let cofaces = 0;
        expected[dim].forEach((simplex, key) => {
          cofaces += rows[key].length;
          for (const p of [2, 3, 5])
            for (let factor = 1; factor < p; factor++) {
              const pushed: [number, number, number][] = [];
              tables.pushCoboundary(dim, key, simplex.f, factor, p, {
                push: (f, k, coef) => pushed.push([f, k, coef]),
              });
              const want = rows[key].map(([f, k, sign]) => [f, k, mod(sign * factor, p)]);
              const byKey = (a: number[], b: number[]) => a[1] - b[1];
              expect(pushed.sort(byKey)).toEqual(want.sort(byKey));
            }
          // The earliest coface (smallest key), if it enters with the simplex.
          const first = rows[key].reduce<[number, number, number] | null>(
            (best, row) => (best === null || row[1] < best[1] ? row : best),
            null,
          );
          const zero = tables.zeroCoface(dim, key, simplex.f);
          if (first !== null && first[0] === simplex.f) {
            expect(zero).toBe(first[1]);
            expect(tables.sign).toBe(first[2]);
          } else expect(zero).toBe(-1);
        });
        // Each (dim+1)-simplex has dim + 2 facets.
        const estimate = expected[dim].length === 0 ? 1 : Math.max(1, cofaces / expected[dim].length);
        expect(tables.cofaceEstimate(dim)).toBe(estimate);
      }
      // The top dimension has no coface rows.
      expect(tables.cofaceEstimate(c.top)).toBe(1);
      for (let dim = 1; dim <= c.top; dim++) {
        expected[dim].forEach((simplex, key) => {
          // The latest facet (largest key), if it entered with the simplex; its sign (−1)^i.
          let latest = -1;
          let sign = 0;
          facetsOf(simplex.tuple).forEach((facet, i) => {
            const k = keyOf[dim - 1].get(facet.join(",")) as number;
            if (k > latest) {
              latest = k;
              sign = i % 2 === 0 ? 1 : -1;
            }
          });
          const zero = tables.zeroFacet(dim, key, simplex.f);
          if (expected[dim - 1][latest].f === simplex.f) {
            expect(zero).toBe(latest);
            expect(tables.sign).toBe(sign);
          } else expect(zero).toBe(-1);
        });
      }
    });
  }

  it("reports every dimension it has counted when the budget runs out at the vertices (worked by hand)", () => {
    // 130 vertices, arcs 0 → 1 … 100 only. The quota is charged for dimensions 0 and 1 before roots 0, 64
    // and 128 and after the last one. Before root 64: 64 vertices + 100 arcs = 164 ≤ 200. Before root 128:
    // 128 vertices + the same 100 arcs = 228 > 200, which the charge of dimension 0 finds.
    const arcs: Arcs = { n: 130, sources: [], targets: [], weights: [] };
    for (let v = 1; v <= 100; v++) {
      arcs.sources.push(0);
      arcs.targets.push(v);
      arcs.weights.push(v);
    }
    const error = errorOf(() => build(graphOf(arcs), 1, 200), SimplexBudgetError);
    expect(Array.from(error.counted)).toEqual([128, 100]);
    expect(error.progress).toBe(128 / 130);
    expect(error.message).toContain("simplex budget of 200 exceeded after 228 simplices");
    // The same limit one simplex higher stops at the end, with every simplex counted: 130 + 100 = 230.
    const complete = errorOf(() => build(graphOf(arcs), 1, 229), SimplexBudgetError);
    expect(Array.from(complete.counted)).toEqual([130, 100]);
    expect(complete.progress).toBe(1);
    expect(() => build(graphOf(arcs), 1, 230)).not.toThrow();
    expect(error.message).toContain("with 98.5% of root vertices done");
    expect(complete.message).toContain("with all root vertices done");
  });

  it("charges the arcs of the roots after the last round of 64 at the end (worked by hand)", () => {
    // Arcs 129 → 0 … 99 only: before root 128, 128 vertices and no arc; at the end 130 + 100 = 230, which
    // only the last charge of dimension 1 sees.
    const arcs: Arcs = { n: 130, sources: [], targets: [], weights: [] };
    for (let v = 0; v < 100; v++) {
      arcs.sources.push(129);
      arcs.targets.push(v);
      arcs.weights.push(1);
    }
    const error = errorOf(() => build(graphOf(arcs), 1, 229), SimplexBudgetError);
    expect(Array.from(error.counted)).toEqual([130, 100]);
    expect(() => build(graphOf(arcs), 1, 230)).not.toThrow();
  });

  it("lists the vertices alone for top dimension 0, and estimates 1 coface for an empty dimension", () => {
    // The path 0 → 1 → 2 → 3 (worked by hand): 4 vertices, 3 edges, no 2-simplex (no arc 0 → 2 nor 1 → 3).
    const path: Arcs = { n: 4, sources: [0, 1, 2], targets: [1, 2, 3], weights: [1, 2, 3] };
    const vertices = build(graphOf(path), 0);
    expect(vertices.counts()).toEqual([4]);
    expect(tuplesOf(vertices, 0, 4)).toEqual([[0], [1], [2], [3]]);
    const tables = build(graphOf(path), 3);
    expect(tables.counts()).toEqual([4, 3, 0, 0]);
    // 3 edges × 2 facets over 4 vertices; no 2-simplex over 3 edges gives 0, at least 1; none of none: 1.
    expect([0, 1, 2, 3].map((dim) => tables.cofaceEstimate(dim))).toEqual([1.5, 1, 1, 1]);
  });

  it("charges the ledger for what it keeps, and names the stage a budget error stops at", () => {
    const arcs = randomArcs(8, 0.6, 4, 201, true);
    const graph = graphOf(arcs);
    const top = 3;
    const counts = bruteForce(arcs, top).map((list) => list.length);
    const ledger = new ByteLedger(undefined);
    buildWith(ledger, graph, top);
    // The listing's doubling arrays (TupleTableBuilder: 256 entries at first, an 8-byte value and 4 bytes a
    // vertex each) hold the smallest 256 · 2^k ≥ count entries; their bytes stand for the sorted tables.
    let listing = 0;
    for (let d = 0; d <= top; d++) {
      let capacity = 256;
      while (capacity < counts[d]) capacity *= 2;
      listing += capacity * (8 + 4 * (d + 1));
    }
    // The rest must hold at least what the links keep: each simplex's facets (4 bytes each), and for each
    // entry of a coface row a 4-byte position and a 1-byte sign, plus the row starts.
    let links = 0;
    for (let d = 1; d <= top; d++) links += counts[d] * (d + 1) * (4 + 4 + 1) + (counts[d - 1] + 1) * 4;
    expect(counts.slice(1).every((c) => c > 20)).toBe(true);
    expect(ledger.held - listing).toBeGreaterThanOrEqual(links);
    // Nothing is given back while the tables are built, so the last reservations are the top dimension's
    // coface rows ((top + 1) entries for each top simplex, 5 bytes each) and, before them, its facets.
    const rows = (top + 1) * counts[top] * 5;
    const stageAt = (maxBytes: number) =>
      errorOf(() => build(graph, top, undefined, maxBytes), HomologyBudgetError).stage;
    expect(stageAt(ledger.held - 1)).toBe("linking directed cofaces");
    expect(stageAt(ledger.held - rows - 1)).toBe("linking directed facets");
    // The first reservation: 256 vertices of 8 + 4 bytes.
    expect(stageAt(256 * 12 - 1)).toBe("listing directed 0-simplices");
    expect(() => build(graph, top, undefined, ledger.held)).not.toThrow();
  });

  it("charges what the links keep for tables of a few simplices too (worked by hand)", () => {
    // The path 0 → 1 → 2 → 3, dimensions 0 … 3: 4 vertices, 3 arcs, no 2- or 3-simplex. The link of
    // dimension 1 keeps the arcs' facets (3 × 2 × 4 = 24 bytes), the vertices' row starts (5 × 4 = 20) and
    // their rows (6 entries × 5 bytes = 30); the links of dimensions 2 and 3 keep only row starts, over the 3
    // arcs (4 × 4 = 16) and over no 2-simplex (1 × 4 = 4): 94 bytes. The listing holds 256 entries a
    // dimension (TupleTableBuilder's first size, 8 bytes a value and 4 a vertex): 256 × (12 + 16 + 20 + 24).
    // None of it is given back while the tables are built, so the ledger must hold both.
    const path: Arcs = { n: 4, sources: [0, 1, 2], targets: [1, 2, 3], weights: [1, 2, 3] };
    const ledger = new ByteLedger(undefined);
    expect(buildWith(ledger, graphOf(path), 3).counts()).toEqual([4, 3, 0, 0]);
    expect(ledger.held - 256 * (12 + 16 + 20 + 24)).toBeGreaterThanOrEqual(94);
  });
});

describe("the clock while the tables are built", () => {
  it("is checked at each root and each of its arcs, every 65,536 simplices sorted and every 4,096 linked", () => {
    // The schedule the code documents, so that a time limit stops every stage: the enumeration checks at
    // each root vertex and at each arc leaving it (never per simplex); the counting sort of each dimension's
    // values, and the linking of each dimension to its facets, check every 65,536 and 4,096 simplices.
    // 4,500 vertices, the i → i+1 path and a few random arcs: 4,500 + arcs vertices and edges, past 4,096.
    const n = 4500;
    const arcs = randomArcs(60, 0.2, 4, 77, true);
    for (let v = 60; v < n - 1; v++) {
      arcs.sources.push(v);
      arcs.targets.push(v + 1);
      arcs.weights.push(1);
    }
    arcs.n = n;
    const graph = graphOf(arcs);
    const monitor = new NotingMonitor({});
    const tables = new DirectedFlagTables(
      graph,
      edgeFiltration(graph, "distance"),
      2,
      new ByteLedger(undefined),
      monitor,
      new SimplexQuota(undefined, 2),
    );
    const counts = tables.counts();
    expect(counts[1]).toBe(arcs.sources.length);
    expect(counts[1]).toBeGreaterThan(4096);
    expect(counts[2]).toBeGreaterThan(1);
    const rounds = (count: number, every: number) => Math.ceil(count / every);
    expect(monitor.afterBegin).toEqual([
      n + counts[1],
      ...counts.map((c) => rounds(c, 65_536)),
      rounds(counts[1], 4096),
      rounds(counts[2], 4096),
    ]);
  });
});

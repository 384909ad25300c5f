/**
 * pushCoboundary against the definition of the coboundary, for both clique layouts and every kind of band
 * a working column asks for. The dense layout has several sweeps (all vertices; the sorted prefix of one
 * row below a horizon; the sorted runs of σ's rows inside a band above σ's value; triangles below a finite
 * horizon apart, by intersecting their vertices' threshold sets), chosen by the band and the row lengths, so
 * a wrong value or a missed coface in one of them shows only on graphs large enough to reach it — larger
 * than the differential tests' graphs.
 *
 * Definition (common practice; e.g. H. Edelsbrunner and J. Harer, Computational Topology, 2010, §IV.1 and
 * §VII.1): the coboundary of σ = {s_0 < … < s_d} in the clique complex has an entry for every vertex v ∉ σ
 * adjacent to all of σ, the coface τ = σ ∪ {v} with coefficient (−1)^j (j = vertices of σ below v) and
 * filtration value max(f(σ), f({s_i, v})); τ is keyed by the combinatorial number system
 * Σ_i C(τ_i, i + 1) (D. E. Knuth, The Art of Computer Programming 4A, 2011, §7.2.1.3).
 * The sink's contract (coface-sink.ts): entries outside [floor, horizon] or ≤ bandLow may be sent or not,
 * every entry inside must be sent once.
 */
import { describe, expect, it } from "vitest";
import { errorOf } from "../../../../test/support/error-of.js";
import { completeGraph } from "../../../../test/support/known-graphs.js";
import { NotingMonitor } from "../../../../test/support/noting-monitor.js";
import { SimplexBudgetError } from "../count/simplex-budget-error.js";
import { edgeFiltration } from "../filtration/edge-filtration.js";
import { fromEdgeList } from "../graph/from-edge-list.js";
import type { WeightedGraph } from "../graph/weighted-graph.js";
import { WorkMonitor } from "../work/work-monitor.js";
import { CliqueCoboundaries, type CliqueLayout } from "./clique-coboundaries.js";
import type { CofaceSink } from "./coface-sink.js";
import { ByteLedger, HomologyBudgetError } from "./homology-budget.js";
import { SimplexQuota } from "./simplex-quota.js";

/** Small seeded generator (a linear congruential one) so that the cases are reproducible. */
function generator(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    return state / 2 ** 32;
  };
}

function binomial(n: number, k: number): number {
  if (k > n) return 0;
  let r = 1;
  for (let i = 1; i <= k; i++) r = (r * (n - k + i)) / i;
  return Math.round(r);
}

interface Case {
  graph: WeightedGraph;
  value: (u: number, v: number) => number;
}

/** G(n, p) with weights from `levels` distinct values (ties when few), distance semantics. */
function randomCase(n: number, p: number, levels: number, random: () => number): Case {
  const sources: number[] = [];
  const targets: number[] = [];
  const weights: number[] = [];
  const table = new Map<number, number>();
  for (let u = 0; u < n; u++) {
    for (let v = u + 1; v < n; v++) {
      if (random() >= p) continue;
      const w = 1 + Math.floor(random() * levels);
      sources.push(u);
      targets.push(v);
      weights.push(w);
      table.set(u * n + v, w);
    }
  }
  const graph = fromEdgeList({ n, sources, targets, weights, directed: false });
  const value = (u: number, v: number) => table.get(Math.min(u, v) * n + Math.max(u, v)) ?? Infinity;
  return { graph, value };
}

/** A random simplex of `count` vertices that is in the complex, with its value; null after many tries. */
function randomSimplex(c: Case, count: number, random: () => number): { s: number[]; f: number } | null {
  const n = c.graph.n;
  for (let attempt = 0; attempt < 200; attempt++) {
    const set = new Set<number>();
    while (set.size < count) set.add(Math.floor(random() * n));
    const s = [...set].sort((a, b) => a - b);
    let f = Number.NEGATIVE_INFINITY;
    for (let a = 0; a < count; a++) for (let b = a + 1; b < count; b++) f = Math.max(f, c.value(s[a], s[b]));
    if (f !== Infinity) return { s, f };
  }
  return null;
}

/** The coboundary entries of σ inside the band, from the definition, as "f key coef" lines, sorted. */
function expectedEntries(
  c: Case,
  s: number[],
  f: number,
  factor: number,
  p: number,
  band: { floor: number; bandLow: number; horizon: number },
): string[] {
  const out: string[] = [];
  for (let v = 0; v < c.graph.n; v++) {
    if (s.includes(v)) continue;
    let fv = f;
    for (const u of s) fv = Math.max(fv, c.value(u, v));
    if (fv === Infinity) continue;
    if (fv < band.floor || fv <= band.bandLow || fv > band.horizon) continue;
    const tau = [...s, v].sort((a, b) => a - b);
    const key = tau.reduce((sum, x, i) => sum + binomial(x, i + 1), 0);
    const j = s.filter((u) => u < v).length;
    const coef = j % 2 === 0 ? factor : (p - factor) % p;
    out.push(`${fv} ${key} ${coef}`);
  }
  return out.sort();
}

/** σ with one vertex replaced by another, if that is in the complex. */
function neighbourSimplex(c: Case, s: number[], random: () => number): { s: number[]; f: number } | null {
  const n = c.graph.n;
  for (let attempt = 0; attempt < 50; attempt++) {
    const v = Math.floor(random() * n);
    if (s.includes(v)) continue;
    const t = [...s];
    t[Math.floor(random() * t.length)] = v;
    t.sort((a, b) => a - b);
    let f = Number.NEGATIVE_INFINITY;
    for (let a = 0; a < t.length; a++)
      for (let b = a + 1; b < t.length; b++) f = Math.max(f, c.value(t[a], t[b]));
    if (f !== Infinity) return { s: t, f };
  }
  return null;
}

/** The value of a random edge {s_i, v} with f < value < horizon, or 0 if there is none (values are ≥ 1). */
function rowValueAbove(c: Case, s: number[], f: number, horizon: number, random: () => number): number {
  const values: number[] = [];
  for (const u of s)
    for (let v = 0; v < c.graph.n; v++) {
      const x = c.value(u, v);
      if (x > f && x < horizon) values.push(x);
    }
  return values.length === 0 ? 0 : values[Math.floor(random() * values.length)];
}

/** A clique of `count` vertices grown from a random vertex by random common neighbours; null if none found. */
function growClique(c: Case, count: number, random: () => number): number[] | null {
  const n = c.graph.n;
  const s = [Math.floor(random() * n)];
  for (let tries = 0; tries < 4 * n && s.length < count; tries++) {
    const v = Math.floor(random() * n);
    if (!s.includes(v) && s.every((u) => c.value(u, v) !== Infinity)) s.push(v);
  }
  return s.length === count ? s.sort((a, b) => a - b) : null;
}

function keyOf(s: number[]): number {
  return s.reduce((sum, x, i) => sum + binomial(x, i + 1), 0);
}

/** The model of `graph` read as distances, to maxDim, with no budget. */
function distanceModel(graph: WeightedGraph, maxDim: number, layout: CliqueLayout): CliqueCoboundaries {
  return new CliqueCoboundaries(
    graph,
    edgeFiltration(graph, "distance"),
    maxDim,
    layout,
    new ByteLedger(undefined),
    new WorkMonitor(undefined),
    new SimplexQuota(undefined, maxDim - 1),
  );
}

/** The cofaces (value, key, coefficient mod 3) that σ's coboundary sends above `bandLow`, sorted. */
function cofacesAbove(model: CliqueCoboundaries, s: number[], f: number, bandLow: number): string[] {
  const got: string[] = [];
  model.pushCoboundary(s.length - 1, keyOf(s), f, 1, 3, {
    bandLow,
    push(fv, key, coef) {
      if (fv > bandLow) got.push(`${fv} ${key} ${coef}`);
    },
  });
  return got.sort();
}

describe("CliqueCoboundaries.pushCoboundary against the definition of the coboundary", () => {
  it("sends every coface inside the band once, with its value, key and sign, in both layouts", () => {
    // Sizes from 20 to 140 vertices so that the dense layout takes each of its sweeps: the sorted-prefix
    // and band sweeps need rows long against the band (the band sweep gives up above half a row).
    const random = generator(20261202);
    const layouts: CliqueLayout[] = ["dense", "sparse"];
    const taken = { checked: 0, finiteHorizon: 0, bandAbove: 0 };
    for (let g = 0; g < 24; g++) {
      const n = 20 + Math.floor(random() * 121);
      const p = g % 3 === 0 ? 1 : 0.6 + 0.4 * random();
      const levels = [12, 40, 5000, 5000][g % 4];
      const c = randomCase(n, p, levels, random);
      const models = layouts.map((layout) => distanceModel(c.graph, 5, layout));
      let band = { floor: Number.NEGATIVE_INFINITY, bandLow: Number.NEGATIVE_INFINITY, horizon: Infinity };
      let previous: number[] = [];
      for (let t = 0; t < 150; t++) {
        const count = 2 + (Math.floor(t / 3) % 3); // edges, triangles, tetrahedra
        // Three simplices in a row share the band and, where possible, all but one vertex: a working
        // column pushes many chain simplices with one band, and the dense sweeps cache per vertex.
        const simplex =
          t % 3 !== 0 && previous.length === count
            ? neighbourSimplex(c, previous, random)
            : randomSimplex(c, count, random);
        if (simplex === null) continue;
        const { s, f } = simplex;
        previous = s;
        if (t % 3 === 0) {
          // Bands as a working column sets them: none; a horizon; a floor or an old horizon above f.
          const spread = levels + 1;
          const above = f + random() * (spread - f);
          band = { floor: Number.NEGATIVE_INFINITY, bandLow: Number.NEGATIVE_INFINITY, horizon: Infinity };
          const kind = Math.floor(random() * 5);
          if (kind >= 1)
            band.horizon = random() < 0.2 ? Infinity : Math.ceil(above + random() * spread * 0.3);
          // Half the floors and old horizons sit exactly on an edge value of σ's rows: ties at the band's
          // ends are where ≥ and > differ.
          const edgeAbove = () => rowValueAbove(c, s, f, band.horizon, random);
          if (kind === 2)
            band.floor = (random() < 0.5 && edgeAbove()) || Math.floor(f + random() * (band.horizon - f));
          if (kind === 3)
            band.bandLow =
              (random() < 0.5 && edgeAbove()) ||
              Math.floor(f + random() * (Math.min(band.horizon, spread) - f));
          if (kind === 4) band.floor = f; // at σ's own value: entries of value f are kept
        }
        if (band.horizon !== Infinity) taken.finiteHorizon++;
        if (band.floor > f || band.bandLow > f) taken.bandAbove++;
        const prime = [2, 3, 5, 7][t % 4];
        const factor = 1 + Math.floor(random() * (prime - 1));
        const expected = expectedEntries(c, s, f, factor, prime, band);
        for (const model of models) {
          const got: string[] = [];
          const sink: CofaceSink = {
            ...band,
            push(fv, key, coef) {
              if (fv < band.floor || fv <= band.bandLow || fv > band.horizon) return;
              got.push(`${fv} ${key} ${coef}`);
            },
          };
          model.pushCoboundary(count - 1, keyOf(s), f, factor, prime, sink);
          expect(got.sort(), `n=${n}, σ=${s}, f=${f}, band ${JSON.stringify(band)}`).toEqual(expected);
          taken.checked++;
        }
      }
    }
    // The cases reach the bands that select the dense sweeps.
    expect(taken.checked).toBeGreaterThan(2000);
    expect(taken.finiteHorizon).toBeGreaterThan(500);
    expect(taken.bandAbove).toBeGreaterThan(300);
  });

  it("sends each coface once when the horizon is raised to +∞ above σ's value and σ's rows are short (worked by hand)", () => {
    // A column whose horizon was raised to +∞ pushes its chain again for the entries above the old horizon
    // (bandLow) only. With σ's rows short against n / 2 the dense layout sweeps σ's rows run by run, each
    // run starting above bandLow: a run started lower holds cofaces that another run sends too.
    // n = 20; σ = {3, 7} of value 1; v = 5: edges 1 and 3, coface value 3; v = 10: edges 5 and 2, value 5;
    // v = 9 touches 7 only. Cofaces above bandLow = 2, by the definition (header): {3, 5, 7}, key
    // C(3, 1) + C(5, 2) + C(7, 3) = 48, one vertex of σ below 5, coefficient −1 = 2 mod 3; {3, 7, 10}, key
    // 3 + C(7, 2) + C(10, 3) = 144, coefficient +1.
    const graph = fromEdgeList({
      n: 20,
      sources: [3, 3, 5, 3, 7, 7],
      targets: [7, 5, 7, 10, 10, 9],
      weights: [1, 1, 3, 5, 2, 4],
      directed: false,
    });
    for (const layout of ["dense", "sparse"] as const) {
      expect(cofacesAbove(distanceModel(graph, 4, layout), [3, 7], 1, 2), layout).toEqual([
        "3 48 2",
        "5 144 1",
      ]);
    }
  });

  it("keeps edges of the largest finite value in a triangle's cofaces above a band, the horizon unset (worked by hand)", () => {
    // Weights may be any finite number, Number.MAX_VALUE too; only an absent edge (+∞) is no edge. n = 20,
    // σ = {2, 5, 9} of value 1 (its three edges 1); bandLow = 1.5, no horizon; σ's rows are short, so the
    // triangle's band is swept run by run. v = 11: edges 2, MAX, MAX; v = 7: edges 1, 3, MAX. Both cofaces
    // have value MAX > bandLow. By the definition (header): {2, 5, 7, 9}, key C(2, 1) + C(5, 2) + C(7, 3) +
    // C(9, 4) = 173, two vertices of σ below 7, coefficient +1; {2, 5, 9, 11}, key 2 + 10 + C(9, 3) +
    // C(11, 4) = 426, three below 11, coefficient −1 = 2 mod 3.
    const max = Number.MAX_VALUE;
    const graph = fromEdgeList({
      n: 20,
      sources: [2, 2, 5, 2, 5, 9, 2, 5, 7],
      targets: [5, 9, 9, 11, 11, 11, 7, 7, 9],
      weights: [1, 1, 1, 2, max, max, 1, 3, max],
      directed: false,
    });
    for (const layout of ["dense", "sparse"] as const) {
      expect(cofacesAbove(distanceModel(graph, 5, layout), [2, 5, 9], 1, 1.5), layout).toEqual([
        `${max} 173 1`,
        `${max} 426 2`,
      ]);
    }
  });

  it("sends every coface above a band once on sparse graphs in the dense layout, the horizon unset or finite", () => {
    // Rows short against n / 2: the band sweeps run by run even when the horizon is +∞ (a column whose
    // horizon was raised to +∞ and is pushed again above its old horizon), which the dense graphs above
    // never reach. Simplices are grown as cliques, so that sparse graphs have them.
    const random = generator(20261203);
    let checked = 0;
    for (let g = 0; g < 16; g++) {
      const n = 30 + Math.floor(random() * 91);
      const levels = [3, 12, 5000][g % 3];
      const c = randomCase(n, 0.03 + 0.1 * random(), levels, random);
      const model = distanceModel(c.graph, 5, "dense");
      for (let t = 0; t < 100; t++) {
        const count = 2 + (t % 3);
        const s = growClique(c, count, random);
        if (s === null) continue;
        let f = Number.NEGATIVE_INFINITY;
        for (let a = 0; a < count; a++)
          for (let b = a + 1; b < count; b++) f = Math.max(f, c.value(s[a], s[b]));
        const horizon = t % 2 === 0 ? Infinity : Math.ceil(f + random() * (levels + 1));
        // On an edge value of σ's rows above f half the time: ties at the band's lower end.
        const low =
          (random() < 0.5 && rowValueAbove(c, s, f, Infinity, random)) || f + random() * (levels + 1 - f);
        const band =
          t % 4 < 2
            ? { floor: Number.NEGATIVE_INFINITY, bandLow: low, horizon }
            : { floor: low, bandLow: Number.NEGATIVE_INFINITY, horizon };
        const expected = expectedEntries(c, s, f, 1, 5, band);
        const got: string[] = [];
        model.pushCoboundary(count - 1, keyOf(s), f, 1, 5, {
          ...(horizon === Infinity ? { floor: band.floor, bandLow: band.bandLow } : band),
          push(fv, key, coef) {
            if (fv < band.floor || fv <= band.bandLow || fv > band.horizon) return;
            got.push(`${fv} ${key} ${coef}`);
          },
        });
        expect(got.sort(), `n=${n}, σ=${s}, f=${f}, band ${JSON.stringify(band)}`).toEqual(expected);
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(500);
  });
});

describe("CliqueCoboundaries construction", () => {
  // K_6 with distinct edge values: every d-simplex has exactly 6 − d − 1 cofaces, and every vertex degree 5
  // (worked by hand).
  const n = 6;
  const sources: number[] = [];
  const targets: number[] = [];
  for (let u = 0; u < n; u++)
    for (let v = u + 1; v < n; v++) {
      sources.push(u);
      targets.push(v);
    }
  const k6 = fromEdgeList({ n, sources, targets, weights: sources.map((_, e) => e + 1), directed: false });
  const make = (layout: CliqueLayout, ledger: ByteLedger, maxSimplices?: number) =>
    new CliqueCoboundaries(
      k6,
      edgeFiltration(k6, "distance"),
      4,
      layout,
      ledger,
      new WorkMonitor({}),
      new SimplexQuota(maxSimplices, 3),
    );

  it("holds the n × n matrices in the budget in the dense layout only, naming each stage", () => {
    const dense = new ByteLedger(undefined);
    const sparse = new ByteLedger(undefined);
    make("dense", dense);
    make("sparse", sparse);
    // The dense layout keeps an n × n matrix of values (8 bytes each), and each row's vertices sorted by
    // value (4-byte vertex, 8-byte value): 20 n² bytes more than the sparse layout at least.
    expect(dense.held - sparse.held).toBeGreaterThanOrEqual(20 * n * n);
    const stageAt = (maxBytes: number) =>
      errorOf(() => make("dense", new ByteLedger({ maxBytes })), HomologyBudgetError).stage;
    expect(stageAt(8 * n * n - 1)).toBe("building the dense edge-value matrix");
    expect(stageAt(20 * n * n - 1)).toBe("sorting the dense edge-value rows");
  });

  it("estimates the cofaces of a simplex: n − d − 1 in the dense layout, the mean degree in the sparse one", () => {
    const dense = make("dense", new ByteLedger(undefined));
    const sparse = make("sparse", new ByteLedger(undefined));
    // A 5-simplex of K_6 has no coface: the estimate is at least 1.
    expect([0, 1, 2, 3, 4, 5].map((d) => dense.cofaceEstimate(d))).toEqual([5, 4, 3, 2, 1, 1]);
    expect([0, 1, 2].map((d) => sparse.cofaceEstimate(d))).toEqual([5, 5, 5]);
  });

  it("names the listing of a dimension as the stage when the budget runs out there", () => {
    // One byte more than construction reserved: the first list of edges asks for more.
    const measured = new ByteLedger(undefined);
    make("sparse", measured);
    const model = make("sparse", new ByteLedger({ maxBytes: measured.held + 1 }));
    expect(errorOf(() => model.listSimplices(1), HomologyBudgetError).stage).toBe("listing the 1-simplices");
  });

  it("finds no facet of an edge entering with it: its facets are vertices", () => {
    const model = make("sparse", new ByteLedger(undefined));
    // Edge {0, 1} (key C(1, 2) + C(0, 1) = 0) enters at 1, its first value.
    expect(model.zeroFacet(1, 0, 1)).toBe(-1);
  });

  it("lists the C(6, d + 1) d-simplices of K_6 in both layouts, and gives their bytes back on release", () => {
    for (const layout of ["dense", "sparse"] as const) {
      const ledger = new ByteLedger(undefined);
      const model = make(layout, ledger);
      const before = ledger.held;
      expect([1, 2, 3].map((d) => model.listSimplices(d).count)).toEqual([15, 20, 15]);
      expect(ledger.held).toBeGreaterThan(before);
      for (const d of [1, 2, 3]) model.releaseSimplices(d);
      expect(ledger.held).toBe(before);
    }
  });

  it("names what it was listing when the simplex budget runs out (counts worked by hand)", () => {
    // 6 vertices + 15 edges = 21 > 20; with 21 allowed, the 20 triangles pass it.
    const edges = errorOf(
      () => make("sparse", new ByteLedger(undefined), 20).listSimplices(1),
      SimplexBudgetError,
    );
    expect(edges.message).toContain("exceeded after 21 simplices with all edges done");
    const triangles = errorOf(
      () => make("sparse", new ByteLedger(undefined), 21).listSimplices(2),
      SimplexBudgetError,
    );
    expect(triangles.message).toContain("exceeded after 41 simplices with all 1-simplices done");
  });

  it("charges its vertices to the simplex quota", () => {
    const error = errorOf(() => make("sparse", new ByteLedger(undefined), 5), SimplexBudgetError);
    expect(Array.from(error.counted)).toEqual([6]);
    expect(error.message).toContain("exceeded after 6 simplices with all vertices done");
  });
});

describe("listing triangles of K_100 (4,950 edges: past one round of 4,096)", () => {
  const k100 = completeGraph(100);

  const make = (monitor: WorkMonitor, maxSimplices?: number) =>
    new CliqueCoboundaries(
      k100,
      edgeFiltration(k100, "distance"),
      2,
      "sparse",
      new ByteLedger(undefined),
      monitor,
      new SimplexQuota(maxSimplices, 2),
    );

  it("checks the clock at least once per 4,096 edges and far less often than once per edge", () => {
    // WorkMonitor's contract: checks every few thousand units of work, never per simplex.
    const monitor = new NotingMonitor({});
    const model = make(monitor);
    model.listSimplices(1);
    monitor.checks = [];
    // C(100, 3) triangles, a closed form.
    expect(model.listSimplices(2).count).toBe(161_700);
    expect(monitor.checks.length).toBeGreaterThanOrEqual(1 + Math.ceil(4950 / 4096));
    expect(monitor.checks.length).toBeLessThan(4950 / 100);
  });

  it("stops at the first round past the budget, before every edge is extended", () => {
    // 10,000 triangles are passed long before the 4,096th edge: the charge there stops the listing, with
    // the share of edges done as its progress.
    const error = errorOf(() => make(new WorkMonitor({}), 10_000).listSimplices(2), SimplexBudgetError);
    expect(error.progress).toBeCloseTo(4096 / 4950, 10);
    expect(error.counted[2]).toBeLessThan(161_700);
  });
});

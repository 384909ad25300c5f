import { describe, expect, it } from "vitest";
import { sweepPolicies } from "../../../../test/support/band-sweep-policies.js";
import { randomArcs } from "../../../../test/support/random-arcs.js";
import { edgeFiltration } from "../filtration/edge-filtration.js";
import { fromEdgeList } from "../graph/from-edge-list.js";
import type { WeightedGraph } from "../graph/weighted-graph.js";
import { WorkMonitor } from "../work/work-monitor.js";
import { DEFAULT_BAND_SWEEP, sweepBands } from "./band-sweep.js";
import { CliqueCoboundaries } from "./clique-coboundaries.js";
import type { CofaceSink } from "./coface-sink.js";
import { reduceDimension } from "./cohomology-reduction.js";
import { computeBarcode } from "./compute-barcode.js";
import { ByteLedger } from "./homology-budget.js";
import { primeField } from "./prime-field.js";
import { SimplexQuota } from "./simplex-quota.js";
import { type PairSink, unionFindPairs } from "./union-find-pairs.js";

/** The clique model of a graph (distances), its edge list, and the edges left to reduce after H0. */
function edgeColumns(graph: WeightedGraph) {
  const ledger = new ByteLedger(undefined);
  const monitor = new WorkMonitor(undefined);
  const model = new CliqueCoboundaries(
    graph,
    edgeFiltration(graph, "distance"),
    3,
    "dense",
    ledger,
    monitor,
    new SimplexQuota(undefined, 2),
  );
  const quiet: PairSink = { pair() {}, essential() {} };
  const cleared = unionFindPairs(model, 0, ledger, quiet, monitor);
  const list = model.listSimplices(1);
  const columns: number[] = [];
  for (let i = 0; i < list.count; i++) if (!cleared.has(list.key[i])) columns.push(i);
  return { model, ledger, monitor, cleared, list, columns: Int32Array.from(columns) };
}

/** Pairs (column key → pivot key, zero-length ones included) and essential columns of the implicit reduction. */
function implicitPairs(graph: WeightedGraph) {
  const { model, ledger, monitor, cleared } = edgeColumns(graph);
  const pairs = new Map<number, number>();
  const essential = new Set<number>();
  const sink: PairSink = {
    pair: (_dim, key, _f, pivotKey) => pairs.set(key, pivotKey),
    essential: (_dim, key) => essential.add(key),
  };
  // Apparent pairs are paired by the choice of columns, the others by the loop: all reach the sink.
  reduceDimension(model, 1, cleared, primeField(2), ledger, sink, true, monitor, null);
  return { pairs, essential };
}

/** Z/2 sum of the coboundaries of a chain: entries met an odd number of times, with their values. */
function coboundaryOf(model: CliqueCoboundaries, keys: number[], fs: number[]): Map<number, number> {
  const odd = new Map<number, number>();
  const sink: CofaceSink = {
    push(f, key) {
      if (odd.has(key)) odd.delete(key);
      else odd.set(key, f);
    },
  };
  for (let e = 0; e < keys.length; e++) model.pushCoboundary(1, keys[e], fs[e], 1, 2, sink);
  return odd;
}

describe("sweepBands", () => {
  // Complete graphs with random integer distances 1–1000 (test/support/random-arcs.ts): long-lived loops
  // whose columns are carried across bands, ties in the values.
  const graphs = [
    fromEdgeList(randomArcs(24, 1, 1000, 3, false)),
    fromEdgeList(randomArcs(30, 1, 60, 4, false)), // many ties
  ];

  for (const [name, policy] of Object.entries(sweepPolicies)) {
    it(`settles exactly the columns up to its reach, as the whole reduction pairs them (${name})`, () => {
      for (const graph of graphs) {
        const { model, ledger, monitor, list, columns } = edgeColumns(graph);
        const reference = implicitPairs(graph);
        const swept = sweepBands(model, 1, list.key, list.f, columns, ledger, monitor, policy);
        const seen = new Map<number, string>();
        for (let q = 0; q < swept.pairs; q++) {
          const i = swept.column[q];
          expect(seen.has(i)).toBe(false);
          seen.set(i, "paired");
          expect(list.f[i]).toBeLessThanOrEqual(swept.reach);
          expect(swept.pivotKey[q]).toBe(reference.pairs.get(list.key[i]));
        }
        for (let q = 0; q < swept.essential; q++) {
          const i = swept.essentialColumn[q];
          expect(seen.has(i)).toBe(false);
          seen.set(i, "essential");
          expect(reference.essential.has(list.key[i])).toBe(true);
        }
        for (let h = 0; h < swept.handedOff; h++) {
          const i = swept.handedOffColumn[h];
          expect(seen.has(i)).toBe(false);
          seen.set(i, "handed off");
          // Its chain holds its own edge, and its coboundary has no entry at or below the reach.
          const from = swept.handedOffChains.start[h];
          const chain = Array.from(
            swept.handedOffChains.pool.subarray(from, from + swept.handedOffChains.length[h]),
          );
          expect(chain).toContain(i);
          const entries = coboundaryOf(
            model,
            chain.map((j) => list.key[j]),
            chain.map((j) => list.f[j]),
          );
          for (const f of entries.values()) expect(f).toBeGreaterThan(swept.reach);
        }
        // Every column up to the reach is accounted for, none above it.
        for (const i of columns) expect(seen.has(i)).toBe(list.f[i] <= swept.reach);
        if (swept.reach === Number.POSITIVE_INFINITY) {
          expect(swept.essential).toBe(reference.essential.size);
          expect(swept.handedOff).toBe(0);
        }
        swept.handedOffChains.dispose();
      }
    });
  }

  it("sweeps the whole filtration, stops early with columns handed off, or after one band, as told", () => {
    const graph = graphs[0];
    const run = (policy: (typeof sweepPolicies)[string]) => {
      const { model, ledger, monitor, list, columns } = edgeColumns(graph);
      return sweepBands(model, 1, list.key, list.f, columns, ledger, monitor, policy);
    };
    const whole = run(sweepPolicies.wholeFiltration);
    expect(whole.reach).toBe(Number.POSITIVE_INFINITY);
    const early = run(sweepPolicies.earlyHandOff);
    expect(early.reach).toBeLessThan(Number.POSITIVE_INFINITY);
    expect(early.handedOff).toBeLessThanOrEqual(sweepPolicies.earlyHandOff.handOffAt);
    const one = run(sweepPolicies.oneBand);
    expect(one.bands).toBe(1);
    expect(one.handedOff).toBeGreaterThan(0);
    // A band that would hold too many entries is not swept: the sweep ends at the band before.
    const capped = run(sweepPolicies.entryCap);
    expect(capped.bands).toBeGreaterThan(1);
    expect(capped.reach).toBeLessThan(Number.POSITIVE_INFINITY);
  });

  it("with the default policy's wide bands, the implicit reduction's bars and pairs (K_64, uniform weights)", () => {
    // The policies above keep bands of a few columns; the default one starts at 4,096 columns a band, where
    // the order of the columns within a band matters (latest first). K_64 with random distances: 41,664
    // triangles and 2,016 edges, both dimensions swept at sizes a test can afford (fromSimplices lowered).
    const graph = fromEdgeList(randomArcs(64, 1, 1_000_000, 11, false));
    const implicit = computeBarcode(graph, {
      semantics: "distance",
      maxDim: 2,
      bandSweep: "off",
      keepZeroLength: true,
    });
    for (const firstBandColumns of [4096, 256]) {
      const policy = { ...DEFAULT_BAND_SWEEP, fromSimplices: 0, firstBandColumns };
      const swept = computeBarcode(graph, {
        semantics: "distance",
        maxDim: 2,
        bandSweep: policy,
        keepZeroLength: true,
      });
      expect(swept.stats.sweptColumns[1]).toBeGreaterThan(0);
      expect(swept.stats.sweptColumns[2]).toBeGreaterThan(100);
      expect(swept.bars).toEqual(implicit.bars);
    }
  });

  it("reduces a band's own columns latest first in the order (f, key), ties in f by key", () => {
    // The reduction's order (CoboundaryModel: (f, dimension, key)) must hold within a band too: which of
    // tied simplices is paired follows it, and columns handed to the implicit reduction continue in it.
    // Seen from outside: the sweep produces each new column's coboundary first, in the order it reduces
    // them. K_30 with 3 distance levels (test/support/random-arcs.ts): bands of thousands of tied edges.
    const graph = fromEdgeList(randomArcs(30, 1, 3, 6, false));
    const { model, ledger, monitor, list, columns } = edgeColumns(graph);
    const order: number[] = [];
    const push = model.pushCoboundary.bind(model);
    model.pushCoboundary = (dim, key, f, factor, p, sink) => {
      order.push(key);
      push(dim, key, f, factor, p, sink);
    };
    const policy = { ...sweepPolicies.wholeFiltration, firstBandColumns: 1 << 20 }; // one band: every column
    const swept = sweepBands(model, 1, list.key, list.f, columns, ledger, monitor, policy);
    swept.handedOffChains.dispose();
    expect(swept.bands).toBe(1);
    // The first push of each column's coboundary comes in the order it is reduced: (f, key) descending.
    const firsts = [...new Set(order)];
    const expected = Array.from(columns)
      .sort((a, b) => (list.f[a] !== list.f[b] ? list.f[b] - list.f[a] : list.key[b] - list.key[a]))
      .map((i) => list.key[i]);
    expect(new Set(Array.from(columns, (i) => list.f[i])).size).toBe(3); // ties: 3 values for 400 columns
    expect(firsts).toEqual(expected);
  });

  it("stops before a band that would not fit the budget, instead of failing", () => {
    // K_24 with every distance equal: one value, so the first band would hold every coface entry (4 per
    // tetrahedron, C(24, 4) = 10,626 tetrahedra) — past the room left by a budget just over what the
    // implicit reduction needs. The sweep gives every column to the implicit reduction, which finishes.
    const sources: number[] = [];
    const targets: number[] = [];
    for (let u = 0; u < 24; u++)
      for (let v = u + 1; v < 24; v++) {
        sources.push(u);
        targets.push(v);
      }
    const flat = fromEdgeList({ n: 24, sources, targets, weights: sources.map(() => 1), directed: false });
    const implicit = computeBarcode(flat, { semantics: "distance", maxDim: 2, bandSweep: "off" });
    const policy = { ...sweepPolicies.wholeFiltration };
    const tight = computeBarcode(flat, {
      semantics: "distance",
      maxDim: 2,
      bandSweep: policy,
      budget: { maxBytes: Math.round(implicit.stats.peakBytes * 1.2) },
    });
    expect(tight.bars).toEqual(implicit.bars);
    expect(tight.stats.sweptColumns).toEqual([0, 0, 0]);
    // With room, the same graph is swept in one band.
    const roomy = computeBarcode(flat, { semantics: "distance", maxDim: 2, bandSweep: policy });
    expect(roomy.bars).toEqual(implicit.bars);
  });

  it("gives back every byte it reserved (the handed-off chains once disposed)", () => {
    for (const policy of Object.values(sweepPolicies)) {
      const { model, ledger, monitor, list, columns } = edgeColumns(graphs[0]);
      const before = ledger.held;
      const swept = sweepBands(model, 1, list.key, list.f, columns, ledger, monitor, policy);
      swept.handedOffChains.dispose();
      expect(ledger.held).toBe(before);
    }
  });
});

import { afterEach, describe, expect, it, vi } from "vitest";
import { sweepPolicies } from "../../../../test/support/band-sweep-policies.js";
import { seededRandom } from "../../../../test/support/random.js";
import { randomArcs } from "../../../../test/support/random-arcs.js";
import { tickingClock } from "../../../../test/support/ticking-clock.js";
import { edgeFiltration } from "../filtration/edge-filtration.js";
import { fromEdgeList } from "../graph/from-edge-list.js";
import type { WeightedGraph } from "../graph/weighted-graph.js";
import type { WorkProgress } from "../work/work-control.js";
import { WorkMonitor } from "../work/work-monitor.js";
import { CliqueCoboundaries } from "./clique-coboundaries.js";
import { reduceDimension } from "./cohomology-reduction.js";
import { type BarcodeOptions, computeBarcode } from "./compute-barcode.js";
import { ByteLedger } from "./homology-budget.js";
import { primeField } from "./prime-field.js";
import { SimplexQuota } from "./simplex-quota.js";
import { type PairSink, unionFindPairs } from "./union-find-pairs.js";

/** K_n with distinct seeded weights (a small linear congruential generator). */
function completeGraph(n: number, seed: number): WeightedGraph {
  let state = seed;
  const sources: number[] = [];
  const targets: number[] = [];
  const weights: number[] = [];
  for (let u = 0; u < n; u++) {
    for (let v = u + 1; v < n; v++) {
      state = (Math.imul(state, 1103515245) + 12345) >>> 0;
      sources.push(u);
      targets.push(v);
      weights.push(1 + state / 2 ** 32);
    }
  }
  return fromEdgeList({ n, sources, targets, weights, directed: false });
}

/** A ledger that also notes what each reservation was for. */
class NotingLedger extends ByteLedger {
  stages: string[] = [];
  override reserve(bytes: number, stage: string): void {
    this.stages.push(stage);
    super.reserve(bytes, stage);
  }
}

const quietSink: PairSink = { pair() {}, essential() {} };

describe("reduceDimension's memory", () => {
  it("gives back every byte it reserved but the pivot map it returns, and names each stage", () => {
    // The budget error names the stage that ran out (HomologyBudgetError.stage); a reservation that is not
    // given back would make later dimensions, and the reported peak, pay for it.
    const graph = completeGraph(24, 5); // more pivots than a map of the smallest size (16) holds
    const ledger = new NotingLedger(undefined);
    const monitor = new WorkMonitor(undefined);
    const model = new CliqueCoboundaries(
      graph,
      edgeFiltration(graph, "distance"),
      4,
      "dense",
      ledger,
      monitor,
      new SimplexQuota(undefined, 3),
    );
    let cleared = unionFindPairs(model, 0, ledger, quietSink, monitor);
    for (const dim of [1, 2]) {
      model.listSimplices(dim); // kept by the model, not by the reduction
      const before = ledger.held;
      ledger.stages = [];
      const reduce = () =>
        reduceDimension(model, dim, cleared, primeField(3), ledger, quietSink, false, monitor);
      const first = reduce();
      expect(first.counters.reduced).toBeGreaterThan(0);
      expect(ledger.stages).toContain(`choosing the ${dim}-simplex columns`);
      // Sized once for every column that may find a pivot: growing it would hold the old and the new
      // table at once (KeyMap.grow).
      expect(
        ledger.stages.filter((stage) => stage === `recording the pivots of dimension ${dim}`),
      ).toHaveLength(1);
      expect(ledger.stages).toContain(`sorting the ${dim}-simplex values`);
      expect(ledger.held).toBeGreaterThan(before); // the pivot map
      first.pivots.dispose();
      expect(ledger.held, `bytes held after dimension ${dim}, its pivot map given back`).toBe(before);
      // Again, keeping the pivots this time: they clear the next dimension.
      const again = reduce();
      cleared.dispose();
      cleared = again.pivots;
    }
  });
});

describe("computeBarcode's peak memory", () => {
  it("stays within twice the peak measured for K_90 to dimension 2 (a memory regression bound)", () => {
    // K_90, distances 1–1000 (test/support/random-arcs.ts, seed 5), Z/2, default budget: measured peak
    // 19,282,064 bytes at main 8044451 (stored entries and their extensions included). The bound is twice
    // that, rounded up: room for a retuning of what columns keep, not for storing whole columns (computing
    // a column's entries to its end at its first extension: 97,269,904), nor for a sorted column list left
    // at 0, which makes every coface window and band span the whole filtration (99,727,504).
    const graph = fromEdgeList(randomArcs(90, 1, 1000, 5, false));
    const barcode = computeBarcode(graph, { semantics: "distance", maxDim: 2, prime: 2 });
    expect(barcode.stats.storedColumns[2]).toBeGreaterThan(0);
    expect(barcode.stats.peakBytes).toBeLessThanOrEqual(40_000_000);
  });
});

describe("reduceDimension's progress", () => {
  afterEach(() => {
    vi.restoreAllMocks();
  });

  /** Progress reports of "reducing columns" while computing the barcode, with a clock that reports at every check. */
  function reductionProgress(
    graph: WeightedGraph,
    maxDim: number,
    bandSweep: BarcodeOptions["bandSweep"] = "auto",
  ): WorkProgress[] {
    tickingClock();
    const seen: WorkProgress[] = [];
    computeBarcode(graph, { semantics: "distance", maxDim, bandSweep, onProgress: (p) => seen.push(p) });
    vi.restoreAllMocks();
    return seen.filter((p) => p.stage === "reducing columns");
  }

  function expectMonotoneWithinTotal(reports: WorkProgress[]) {
    for (let i = 0; i < reports.length; i++) {
      expect(reports[i].done).toBeGreaterThanOrEqual(i === 0 ? 0 : reports[i - 1].done);
      expect(reports[i].done).toBeLessThanOrEqual(reports[i].total);
    }
  }

  it("reports columns done between 0 and the column count, never going back", () => {
    // K_31: 465 edge columns and 4,495 triangle columns (C(31, 3)), more than one 4,096-column stride.
    // Also with the sweep over bands forced, each way it can end: it reports the columns it settles.
    for (const bandSweep of ["off" as const, ...Object.values(sweepPolicies)]) {
      const seen = reductionProgress(completeGraph(31, 9), 2, bandSweep);
      for (const dim of [1, 2]) {
        const reports = seen.filter((p) => p.dim === dim);
        expect(reports.length).toBeGreaterThan(2);
        expect(reports[0].total).toBe(dim === 1 ? 465 : 4495);
        expectMonotoneWithinTotal(reports);
      }
    }
  });

  it("checks the clock at least once per 8,192 simplices while choosing, and far less often than per simplex, column or addition", () => {
    // WorkMonitor's contract: callers check every few thousand units of work, never per simplex. The
    // reduction's documented stride is one check per 4,096 simplices while it chooses the columns to
    // reduce, then one per 64 columns and per 64 additions; the bounds below leave a factor 2 (and the
    // upper one far more) so that a retuned stride passes. K_40, distances 1–1000 (test/support/
    // random-arcs.ts, seed 1): C(40, 3) = 9,880 triangle columns, hundreds reduced, a thousand additions.
    tickingClock();
    const seen: WorkProgress[] = [];
    const graph = fromEdgeList(randomArcs(40, 1, 1000, 1, false));
    const barcode = computeBarcode(graph, {
      semantics: "distance",
      maxDim: 2,
      bandSweep: "off", // the implicit reduction's strides (the sweep's below)
      onProgress: (p) => seen.push(p),
    });
    const stats = barcode.stats;
    const reports = seen.filter((p) => p.stage === "reducing columns" && p.dim === 2);
    expect(stats.simplices[2]).toBe(9880);
    // Columns settled while choosing (cleared or apparent), then the ones reduced (emergent or not): the
    // reduction's reports count columns done, so its first report past the choice is the settled count.
    const columns = stats.emergentPairs[2] + stats.columnsReduced[2];
    const settled = stats.simplices[2] - columns;
    expect(columns).toBeGreaterThan(256);
    expect(stats.columnAdditions[2]).toBeGreaterThan(512);
    const firstOfLoop = reports.findIndex((p) => p.done >= settled);
    expect(firstOfLoop).toBeGreaterThan(0);
    const choosing = firstOfLoop - 1; // after the report of the stage's begin
    const reducing = reports.length - firstOfLoop;
    expect(choosing).toBeGreaterThanOrEqual(Math.ceil(stats.simplices[2] / 8192));
    expect(choosing).toBeLessThan(stats.simplices[2] / 100);
    expect(reducing).toBeGreaterThanOrEqual(Math.ceil(columns / 128));
    expect(reducing).toBeLessThanOrEqual((columns + stats.columnAdditions[2]) / 32 + 2);
  });

  it("also when many of the columns past 4,096 need work (G(100, 0.85), edges)", () => {
    // Over 4,096 edge columns, hundreds of them reduced: a report made while the columns are being chosen
    // must count only those settled so far, or it passes the total.
    const random = seededRandom(1);
    const sources: number[] = [];
    const targets: number[] = [];
    const weights: number[] = [];
    for (let u = 0; u < 100; u++) {
      for (let v = u + 1; v < 100; v++) {
        if (random() >= 0.85) continue;
        sources.push(u);
        targets.push(v);
        weights.push(1 + Math.floor(random() * 1000));
      }
    }
    for (const bandSweep of ["off" as const, "auto" as const, sweepPolicies.earlyHandOff]) {
      const reports = reductionProgress(
        fromEdgeList({ n: 100, sources, targets, weights, directed: false }),
        1,
        bandSweep,
      );
      expect(reports.length).toBeGreaterThan(2);
      expect(reports[0].total).toBe(sources.length);
      expectMonotoneWithinTotal(reports);
    }
    expect(sources.length).toBeGreaterThan(4096);
  });

  it("the sweep over bands checks the clock at least once per 64 columns and per 64 additions", () => {
    // The sweep's contract is the implicit reduction's: a time limit is noticed within a bounded amount of
    // work, here within a band too. K_40 as above, every column swept.
    tickingClock();
    let checks = 0;
    const graph = fromEdgeList(randomArcs(40, 1, 1000, 1, false));
    const barcode = computeBarcode(graph, {
      semantics: "distance",
      maxDim: 2,
      bandSweep: sweepPolicies.wholeFiltration,
      onProgress: (p) => {
        if (p.stage === "reducing columns" && p.dim === 2) checks++;
      },
    });
    const swept = barcode.stats.sweptColumns[2] + barcode.stats.apparentPairs[2];
    expect(barcode.stats.sweptColumns[2]).toBeGreaterThan(256);
    expect(checks).toBeGreaterThanOrEqual(Math.floor(swept / 64));
    expect(checks).toBeLessThan(swept / 8);
  });
});

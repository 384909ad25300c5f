import { edgeFiltration, filtrationStart } from "../filtration/edge-filtration.js";
import { fromFiltrationValue, type WeightSemantics } from "../filtration/weight-semantics.js";
import type { WeightedGraph } from "../graph/weighted-graph.js";
import type { WorkControl } from "../work/work-control.js";
import { WorkMonitor } from "../work/work-monitor.js";
import { type BandSweepPolicy, DEFAULT_BAND_SWEEP } from "./band-sweep.js";
import type { Bar, Barcode } from "./barcode.js";
import { CliqueCoboundaries, type CliqueLayout } from "./clique-coboundaries.js";
import type { CoboundaryModel } from "./coboundary-model.js";
import { reduceDimension } from "./cohomology-reduction.js";
import { DirectedFlagTables } from "./directed-flag-tables.js";
import { ByteLedger, type HomologyBudget } from "./homology-budget.js";
import { primeField } from "./prime-field.js";
import { SimplexQuota } from "./simplex-quota.js";
import { type PairSink, unionFindPairs } from "./union-find-pairs.js";

export interface BarcodeOptions extends WorkControl {
  readonly semantics: WeightSemantics;
  /** Highest homology dimension computed (0 … maxDim); simplices of dimension maxDim + 1 are used. */
  readonly maxDim: number;
  /** Prime p of the coefficients Z/p (default 2). */
  readonly prime?: number;
  readonly budget?: HomologyBudget;
  /**
   * Stop with a SimplexBudgetError once the simplices listed (all dimensions up to maxDim, and maxDim + 1
   * for directed graphs, whose tables list their cofaces too) pass this number. Default: no limit beyond
   * the memory budget.
   */
  readonly maxSimplices?: number;
  /** Keep bars with birth = death (default false: they carry no topology and are many). */
  readonly keepZeroLength?: boolean;
  /**
   * Undirected graphs only: look edge values up in an n×n matrix ("dense") or in the sparse rows
   * ("sparse"). Default "auto": dense when the matrix is small against the budget and the graph is not
   * very sparse. Both give identical barcodes.
   */
  readonly cliqueLayout?: "auto" | CliqueLayout;
  /**
   * Z/2 only: reduce the columns of the early part of the filtration explicitly, band of values by band
   * (see sweepBands), before the implicit reduction of the rest. "auto" (default): with the default policy;
   * "off": never; a policy: with it (tests use small bands). Both give identical barcodes.
   */
  readonly bandSweep?: "auto" | "off" | BandSweepPolicy;
}

/**
 * Persistence barcode of the weight filtration of the clique complex (undirected graph) or the directed
 * flag complex (directed graph), dimensions 0 … maxDim, coefficients Z/p.
 *
 * Ties: simplices enter in the order (f, dimension, then a fixed combinatorial order: the combinatorial
 * number system index of the ascending vertex set for cliques, the lexicographic order of the vertex tuple
 * for directed simplices). Which simplex creates or kills a class among tied ones follows that order;
 * the births and deaths themselves do not depend on it.
 */
export function computeBarcode(graph: WeightedGraph, options: BarcodeOptions): Barcode {
  const { semantics } = options;
  const maxDim = options.maxDim;
  if (!Number.isInteger(maxDim) || maxDim < 0)
    throw new RangeError(`maxDim must be a non-negative integer, got ${maxDim}`);
  const field = primeField(options.prime ?? 2);
  const keepZeroLength = options.keepZeroLength ?? false;
  const ledger = new ByteLedger(options.budget);
  const monitor = new WorkMonitor(options);
  const quota = new SimplexQuota(options.maxSimplices, maxDim + 1);
  const edgeF = edgeFiltration(graph, semantics);
  const start = filtrationStart(graph, semantics);

  let model: CoboundaryModel;
  let representation: Barcode["stats"]["representation"];
  if (graph.directed) {
    model = new DirectedFlagTables(graph, edgeF, maxDim + 1, ledger, monitor, quota);
    representation = "directed-tables";
  } else {
    const layout = chooseLayout(graph, options.cliqueLayout ?? "auto", ledger.maxBytes);
    model = new CliqueCoboundaries(graph, edgeF, maxDim + 2, layout, ledger, monitor, quota);
    representation = layout === "dense" ? "clique-dense" : "clique-sparse";
  }

  const raw: RawBar[] = [];
  const vertexBuffer = new Int32Array(maxDim + 2);
  const tupleOf = (dim: number, key: number): number[] => {
    model.vertices(dim, key, vertexBuffer);
    return Array.from(vertexBuffer.subarray(0, dim + 1));
  };
  const sink: PairSink = {
    pair(dim, birthKey, birthF, deathKey, deathF) {
      if (birthF === deathF && !keepZeroLength) return;
      raw.push({ dim, birthF, deathF, birth: tupleOf(dim, birthKey), death: tupleOf(dim + 1, deathKey) });
    },
    essential(dim, birthKey, birthF) {
      raw.push({ dim, birthF, deathF: Infinity, birth: tupleOf(dim, birthKey), death: null });
    },
  };

  const zeros = () => new Array<number>(maxDim + 1).fill(0);
  const stats = {
    simplices: zeros(),
    clearedColumns: zeros(),
    apparentPairs: zeros(),
    emergentPairs: zeros(),
    columnsReduced: zeros(),
    columnAdditions: zeros(),
    storedColumns: zeros(),
    sweptColumns: zeros(),
    peakBytes: 0,
    representation,
  };
  stats.simplices[0] = graph.n;

  const sweepOption = options.bandSweep ?? "auto";
  const sweepPolicy =
    sweepOption === "off" ? null : sweepOption === "auto" ? DEFAULT_BAND_SWEEP : sweepOption;
  let cleared = unionFindPairs(model, start, ledger, sink, monitor);
  for (let dim = 1; dim <= maxDim; dim++) {
    const { pivots, counters } = reduceDimension(
      model,
      dim,
      cleared,
      field,
      ledger,
      sink,
      keepZeroLength,
      monitor,
      sweepPolicy,
    );
    cleared.dispose();
    cleared = pivots;
    if (dim >= 2) model.releaseSimplices(dim - 1);
    stats.simplices[dim] = counters.simplices;
    stats.clearedColumns[dim] = counters.cleared;
    stats.apparentPairs[dim] = counters.apparent;
    stats.emergentPairs[dim] = counters.emergent;
    stats.columnsReduced[dim] = counters.reduced;
    stats.columnAdditions[dim] = counters.additions;
    stats.storedColumns[dim] = counters.stored;
    stats.sweptColumns[dim] = counters.swept;
  }
  cleared.dispose();
  stats.peakBytes = ledger.peak;

  raw.sort(
    (a, b) => a.dim - b.dim || a.birthF - b.birthF || a.deathF - b.deathF || compareTuples(a.birth, b.birth),
  );
  const bars: Bar[] = raw.map((r) => ({
    dim: r.dim,
    birth: fromFiltrationValue(r.birthF, semantics),
    death: r.deathF === Infinity ? null : fromFiltrationValue(r.deathF, semantics),
    birthSimplex: r.birth,
    deathSimplex: r.death,
  }));
  return {
    bars,
    prime: field.p,
    maxDim,
    semantics,
    directed: graph.directed,
    start: fromFiltrationValue(start, semantics),
    keepZeroLength,
    stats,
  };
}

interface RawBar {
  dim: number;
  birthF: number;
  deathF: number;
  birth: number[];
  death: number[] | null;
}

function compareTuples(a: readonly number[], b: readonly number[]): number {
  for (let i = 0; i < a.length && i < b.length; i++) if (a[i] !== b[i]) return a[i] - b[i];
  return a.length - b.length;
}

/** Dense matrix when it takes at most an eighth of the budget and the graph has ≥ 5 % of all edges. */
function chooseLayout(
  graph: WeightedGraph,
  requested: "auto" | CliqueLayout,
  maxBytes: number,
): CliqueLayout {
  if (requested !== "auto") return requested;
  const n = graph.n;
  const matrixBytes = n * n * 8;
  const possible = n * (n - 1);
  const dense = possible > 0 && graph.targets.length / possible >= 0.05;
  return dense && matrixBytes <= maxBytes / 8 ? "dense" : "sparse";
}

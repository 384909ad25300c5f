import { edgeBins } from "../filtration/edge-bins.js";
import { edgeFiltration } from "../filtration/edge-filtration.js";
import { gridFiltrationValues, type ThresholdGrid } from "../filtration/threshold-grid.js";
import type { WeightedGraph } from "../graph/weighted-graph.js";
import { WorkMonitor } from "../work/work-monitor.js";
import { enumerateAnnotated } from "./annotated-enumerator.js";
import { resolveLimits } from "./count-limits.js";
import { buildEnumerationGraph } from "./enumeration-graph.js";
import type { CountOptions, SweepCounts } from "./types.js";
import { countWithWasm } from "./wasm/wasm-counter.js";

export interface SweepOptions extends CountOptions {
  /**
   * "webassembly": count each threshold's graph in the WebAssembly kernel; "typescript": one annotated
   * enumeration in TypeScript (the reference). Default "auto": WebAssembly where the runtime provides it.
   * Both give identical results.
   */
  kernel?: "auto" | "webassembly" | "typescript";
}

/**
 * Simplex counts and Euler characteristic at every threshold of `grid`, from one enumeration: each
 * simplex lands in the bin of its latest edge (hist[k][bin]); prefix sums over bins give the counts at
 * every threshold. Edges entering after the last threshold are left out up front. Vertices are present
 * at every threshold.
 *
 * Where the WebAssembly kernel runs and the graph is dense against maxDim, each threshold's graph is counted
 * by it instead (plain counts: the last level is a popcount, not one visit per simplex), which then costs
 * a fraction of one annotated enumeration; the counts are the same.
 */
export function sweepSimplexCounts(
  graph: WeightedGraph,
  grid: ThresholdGrid,
  options: SweepOptions = {},
): SweepCounts {
  const { maxDim, budget } = resolveLimits(options);
  const gridF = gridFiltrationValues(grid);
  const T = gridF.length;
  const thresholds = Float64Array.from(grid.thresholds);
  if (T === 0) return { thresholds, counts: [], euler: new Float64Array(0), truncated: false };
  const bins = edgeBins(edgeFiltration(graph, grid.semantics), gridF);
  const monitor = new WorkMonitor(options);
  const kernel = options.kernel ?? "auto";
  if (kernel !== "auto" && kernel !== "webassembly" && kernel !== "typescript")
    throw new RangeError(`kernel must be "auto", "webassembly" or "typescript", got ${String(kernel)}`);
  const perThreshold =
    kernel === "typescript" || (kernel === "auto" && !perThresholdPays(graph, bins, T, maxDim))
      ? null
      : countEachThreshold(graph, bins, T, maxDim, budget, monitor);
  if (perThreshold === null && kernel === "webassembly")
    throw new Error(
      "the WebAssembly counting kernel is not available here, or its memory cannot hold this graph",
    );
  if (perThreshold !== null) return { thresholds, ...perThreshold };
  const g = buildEnumerationGraph(graph, bins);
  monitor.begin("counting simplices", 0, g.n);
  const r = enumerateAnnotated(g, {
    maxDim,
    budget,
    monitor,
    bins,
    binCount: T,
    participation: false,
    edgeParticipation: false,
    slotCount: graph.targets.length,
    reverse: null,
  });
  const top = r.hist.length - 1;
  const counts: Float64Array[] = [];
  const euler = new Float64Array(T);
  const running = new Float64Array(top + 1);
  for (let t = 0; t < T; t++) {
    let chi = 0;
    for (let k = 0; k <= top; k++) {
      running[k] += r.hist[k][t];
      chi += k % 2 === 0 ? running[k] : -running[k];
    }
    euler[t] = chi;
    counts.push(running.slice());
  }
  return { thresholds, counts, euler, truncated: r.truncated };
}

/**
 * Whether T plain counts beat one annotated enumeration. The enumeration visits every simplex up to
 * maxDim; a plain count visits those below maxDim and popcounts the last level. In a graph of density ρ the
 * top level outnumbers the one below by about (n − maxDim)/(maxDim + 1) · ρ^maxDim (the expected clique
 * counts of G(n, ρ), C(n, k+1) ρ^C(k+1,2)), so T counts pay when that ratio is well above T (the earlier
 * thresholds' graphs are also smaller). Sparse graphs, and counts to high dimensions, keep the enumeration.
 */
function perThresholdPays(graph: WeightedGraph, bins: Int32Array, T: number, maxDim: number): boolean {
  const n = graph.n;
  if (n < 2 || !Number.isFinite(maxDim) || maxDim < 2) return false;
  let kept = 0;
  for (let s = 0; s < bins.length; s++) if (bins[s] >= 0) kept++;
  const density = kept / (n * (n - 1)); // both directions of an undirected edge are slots
  const ratio = ((n - maxDim) / (maxDim + 1)) * density ** maxDim;
  return ratio > T / 2;
}

/**
 * Plain counts of every threshold's graph in the WebAssembly kernel, padded to the dimensions present at
 * the last threshold (the largest graph, counted first so a budget error comes before other work); null
 * when the kernel is not available.
 */
function countEachThreshold(
  graph: WeightedGraph,
  bins: Int32Array,
  T: number,
  maxDim: number,
  budget: number,
  monitor: WorkMonitor,
): { counts: Float64Array[]; euler: Float64Array; truncated: boolean } | null {
  const mask = new Int32Array(bins.length);
  const countAt = (t: number) => {
    for (let s = 0; s < bins.length; s++) mask[s] = bins[s] >= 0 && bins[s] <= t ? 0 : -1;
    const g = buildEnumerationGraph(graph, mask);
    monitor.begin("counting simplices", 0, g.n);
    return countWithWasm(g, maxDim, budget, monitor);
  };
  const last = countAt(T - 1);
  if (last === null) return null;
  const width = last.counts.length;
  const counts: Float64Array[] = new Array(T);
  const euler = new Float64Array(T);
  for (let t = T - 1; t >= 0; t--) {
    const plain = t === T - 1 ? last : countAt(t);
    if (plain === null) return null;
    const row = new Float64Array(width);
    row.set(plain.counts.subarray(0, width));
    let chi = 0;
    for (let k = 0; k < width; k++) chi += k % 2 === 0 ? row[k] : -row[k];
    counts[t] = row;
    euler[t] = chi;
  }
  return { counts, euler, truncated: last.truncated };
}

import { edgeBins } from "../filtration/edge-bins.js";
import { edgeFiltration } from "../filtration/edge-filtration.js";
import { gridFiltrationValues, type ThresholdGrid } from "../filtration/threshold-grid.js";
import type { WeightedGraph } from "../graph/weighted-graph.js";
import { WorkMonitor } from "../work/work-monitor.js";
import { enumerateAnnotated } from "./annotated-enumerator.js";
import { resolveLimits } from "./count-limits.js";
import { buildEnumerationGraph } from "./enumeration-graph.js";
import type { CountOptions, SweepCounts } from "./types.js";

/**
 * Simplex counts and Euler characteristic at every threshold of `grid`, from one enumeration: each
 * simplex lands in the bin of its latest edge (hist[k][bin]); prefix sums over bins give the counts at
 * every threshold. Edges entering after the last threshold are left out up front. Vertices are present
 * at every threshold.
 */
export function sweepSimplexCounts(
  graph: WeightedGraph,
  grid: ThresholdGrid,
  options: CountOptions = {},
): SweepCounts {
  const { maxDim, budget } = resolveLimits(options);
  const gridF = gridFiltrationValues(grid);
  const T = gridF.length;
  const thresholds = Float64Array.from(grid.thresholds);
  if (T === 0) return { thresholds, counts: [], euler: new Float64Array(0), truncated: false };
  const bins = edgeBins(edgeFiltration(graph, grid.semantics), gridF);
  const g = buildEnumerationGraph(graph, bins);
  const monitor = new WorkMonitor(options);
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

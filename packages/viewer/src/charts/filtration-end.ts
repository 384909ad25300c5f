import type { GraphAnalysis } from "../compute/graph-analysis.js";

/** Where bars that never die are drawn to: the last edge value (the end of the filtration). */
export function filtrationEnd(analysis: GraphAnalysis): number {
  const { thresholds, start } = analysis;
  return thresholds.length > 0 ? thresholds[thresholds.length - 1] : start;
}

import { toFiltrationValue } from "@cliquescape/core";
import type { GraphAnalysis } from "../compute/graph-analysis.js";

/** Where bars that never die are drawn to: the last edge value (the end of the filtration). */
export function filtrationEnd(analysis: GraphAnalysis): number {
  const { thresholds, start } = analysis;
  return thresholds.length > 0 ? thresholds[thresholds.length - 1] : start;
}

/** Persistence of a bar in filtration units; essential bars last forever. */
export function persistence(analysis: GraphAnalysis, bar: number): number {
  const { birth, death } = analysis.bars[bar];
  if (death === null) return Infinity;
  return toFiltrationValue(death, analysis.semantics) - toFiltrationValue(birth, analysis.semantics);
}

/** Bar numbers of one dimension, most persistent first (ties: earlier birth first, then bar number). */
export function barsByPersistence(analysis: GraphAnalysis, dim: number): number[] {
  const chosen: number[] = [];
  analysis.bars.forEach((bar, i) => {
    if (bar.dim === dim) chosen.push(i);
  });
  return chosen.sort((a, b) => persistence(analysis, b) - persistence(analysis, a) || a - b);
}

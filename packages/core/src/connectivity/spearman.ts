import { averageRanks } from "./average-ranks.js";
import { pearsonMatrix } from "./pearson.js";
import type { TimeSeries } from "./time-series.js";

/**
 * Spearman rank correlation between every pair of channels: the Pearson correlation of the channels'
 * ranks over time, tied values taking their average rank (C. Spearman, "The proof and measurement of
 * association between two things", Am. J. Psychol. 15, 1904). n × n row-major, 1 on the diagonal.
 */
export function spearmanMatrix(series: TimeSeries): Float64Array {
  const { channels: n, timePoints: T, values } = series;
  const ranks = new Float64Array(n * T);
  const sorted = new Float64Array(T);
  for (let c = 0; c < n; c++) averageRanks(values, c * T, T, ranks, c * T, sorted);
  return pearsonMatrix({ channels: n, timePoints: T, values: ranks });
}

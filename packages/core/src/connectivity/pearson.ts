import { rowGram } from "./row-dot-products.js";
import { standardizeRows } from "./standardize-rows.js";
import type { TimeSeries } from "./time-series.js";

/**
 * Pearson correlation between every pair of channels, as an n × n row-major matrix with 1 on the diagonal:
 * r_ij = Σ_t (x_it − x̄_i)(x_jt − x̄_j) / sqrt(Σ_t (x_it − x̄_i)² · Σ_t (x_jt − x̄_j)²), clipped to [−1, 1]
 * against rounding (as numpy.corrcoef does). Channels must be finite and not constant.
 */
export function pearsonMatrix(series: TimeSeries): Float64Array {
  const { channels: n, timePoints: T, values } = series;
  const z = standardizeRows(values, n, T, T, 0, new Float64Array(n * T));
  const r = rowGram(z, n, T, new Float64Array(n * n));
  clipCorrelations(r, n);
  return r;
}

/** Clips rounding excursions beyond ±1 and sets the diagonal to exactly 1. */
export function clipCorrelations(r: Float64Array, n: number): void {
  for (let k = 0; k < r.length; k++) {
    if (r[k] > 1) r[k] = 1;
    else if (r[k] < -1) r[k] = -1;
  }
  for (let i = 0; i < n; i++) r[i * n + i] = 1;
}

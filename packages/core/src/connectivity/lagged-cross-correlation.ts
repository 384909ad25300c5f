import { rowCrossProducts } from "./row-dot-products.js";
import { standardizeRows } from "./standardize-rows.js";
import type { TimeSeries } from "./time-series.js";

/** A directed network from lagged correlations, and the lag each arc was read at. */
export interface LaggedCrossCorrelation {
  /** n × n row-major: entry (i, j) is the arc i → j; the diagonal is 0. */
  values: Float64Array;
  /** n × n: the lag (1..maxLag, in time points) of each arc; 0 on the diagonal. */
  lags: Int32Array;
}

/**
 * Directed lagged cross-correlation: for every ordered pair (i, j) and every lag ℓ = 1..maxLag, the Pearson
 * correlation of channel i's first T − ℓ time points with channel j's last T − ℓ,
 *   r_ij(ℓ) = corr(x_i[0 .. T−ℓ−1], x_j[ℓ .. T−1])   (i leads j by ℓ; numpy: corrcoef(x[:-ℓ], y[ℓ:])),
 * and the arc i → j carries the r_ij(ℓ) of largest absolute value, sign kept; on equal |r| the shorter lag
 * wins. The cross-correlation function of two series at lag ℓ is textbook (G. E. P. Box, G. M. Jenkins,
 * "Time Series Analysis: Forecasting and Control", 1970, ch. 11 — recalled from memory); here each
 * overlapping segment is standardised with its own mean and variance, which is exactly numpy's corrcoef of
 * the two slices. A segment without variation correlates 0 at that lag. Needs T − maxLag ≥ 2.
 */
export function laggedCrossCorrelation(series: TimeSeries, maxLag: number): LaggedCrossCorrelation {
  const { channels: n, timePoints: T, values } = series;
  const best = new Float64Array(n * n);
  const lags = new Int32Array(n * n);
  const head = new Float64Array(n * (T - 1));
  const tail = new Float64Array(n * (T - 1));
  const r = new Float64Array(n * n);
  for (let lag = 1; lag <= maxLag; lag++) {
    const length = T - lag;
    standardizeRows(values, n, length, T, 0, head);
    standardizeRows(values, n, length, T, lag, tail);
    rowCrossProducts(head, tail, n, length, r);
    for (let k = 0; k < r.length; k++) {
      const x = Math.min(1, Math.max(-1, r[k]));
      if (Math.abs(x) > Math.abs(best[k]) || lags[k] === 0) {
        best[k] = x;
        lags[k] = lag;
      }
    }
  }
  for (let i = 0; i < n; i++) {
    best[i * n + i] = 0;
    lags[i * n + i] = 0;
  }
  return { values: best, lags };
}

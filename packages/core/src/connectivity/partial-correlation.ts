import { invertPositiveDefinite } from "./invert-positive-definite.js";
import { ledoitWolfCovariance } from "./ledoit-wolf.js";
import type { TimeSeries } from "./time-series.js";

/**
 * Partial correlations from a precision (inverse covariance) matrix P: ρ_ij = −P_ij / sqrt(P_ii · P_jj),
 * the correlation of channels i and j once every other channel is regressed out (standard identity; e.g.
 * J. Whittaker, "Graphical Models in Applied Multivariate Statistics", 1990, ch. 5). n × n row-major,
 * 1 on the diagonal.
 */
export function partialCorrelationFromPrecision(precision: Float64Array, n: number): Float64Array {
  const rho = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      rho[i * n + j] =
        i === j ? 1 : -precision[i * n + j] / Math.sqrt(precision[i * n + i] * precision[j * n + j]);
    }
  }
  return rho;
}

/** Partial correlations between channels, from the inverse of their Ledoit–Wolf shrunk covariance. */
export interface ShrinkagePartialCorrelation {
  values: Float64Array;
  /** The Ledoit–Wolf shrinkage weight used. */
  shrinkage: number;
}

/**
 * Shrinkage partial correlation: invert the Ledoit–Wolf covariance (see ledoitWolfCovariance), then
 * normalise the precision's off-diagonal. Null when the shrunk covariance is not positive definite, which
 * happens only when the shrinkage is 0 and the sample covariance is singular.
 */
export function shrinkagePartialCorrelation(series: TimeSeries): ShrinkagePartialCorrelation | null {
  const { covariance, shrinkage } = ledoitWolfCovariance(series);
  const precision = invertPositiveDefinite(covariance, series.channels);
  if (!precision) return null;
  return { values: partialCorrelationFromPrecision(precision, series.channels), shrinkage };
}

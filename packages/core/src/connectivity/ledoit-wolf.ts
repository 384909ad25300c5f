import { rowGram } from "./row-dot-products.js";
import type { TimeSeries } from "./time-series.js";

/** A shrunk covariance matrix and how far it was shrunk. */
export interface ShrunkCovariance {
  /** n × n row-major: (1 − shrinkage)·S + shrinkage·μ·I. */
  covariance: Float64Array;
  /** The weight of the target μ·I, in [0, 1]. */
  shrinkage: number;
  /** μ = tr(S) / n: the average variance, the scale of the target. */
  mu: number;
}

/**
 * The Ledoit–Wolf shrinkage estimate of the covariance between channels (O. Ledoit, M. Wolf, "A
 * well-conditioned estimator for large-dimensional covariance matrices", J. Multivariate Analysis 88,
 * 2004, section 3): the sample covariance S = XᵀX / T of the centred data (T time points, divided by T, not
 * T − 1) pulled towards μ·I, with the weight β²/δ² that minimises the expected quadratic loss, estimated
 * from the data:
 *   δ² = ‖S − μI‖²,  β̄² = (1/T²) Σ_t ‖x_t x_tᵀ − S‖²,  β² = min(β̄², δ²),  ‖A‖² = tr(AAᵀ) / n.
 * Well-conditioned even with fewer time points than channels. Same estimator as scikit-learn's
 * sklearn.covariance.LedoitWolf (which the tests compare against).
 */
export function ledoitWolfCovariance(series: TimeSeries): ShrunkCovariance {
  const { channels: n, timePoints: T, values } = series;
  const centred = new Float64Array(n * T);
  for (let c = 0; c < n; c++) {
    const from = c * T;
    let sum = 0;
    for (let t = 0; t < T; t++) sum += values[from + t];
    const mean = sum / T;
    for (let t = 0; t < T; t++) centred[from + t] = values[from + t] - mean;
  }
  const S = rowGram(centred, n, T, new Float64Array(n * n));
  for (let k = 0; k < S.length; k++) S[k] /= T;
  let trace = 0;
  for (let i = 0; i < n; i++) trace += S[i * n + i];
  const mu = trace / n;
  if (n === 1) return { covariance: S, shrinkage: 0, mu };

  // Σ_ij S_ij², and Σ_t (Σ_i x_ti²)² = Σ_ij Σ_t x_ti² x_tj², the two sums the estimate is made of.
  let squaredEntries = 0;
  for (let k = 0; k < S.length; k++) squaredEntries += S[k] * S[k];
  const rowSquares = new Float64Array(T);
  for (let c = 0; c < n; c++) {
    const from = c * T;
    for (let t = 0; t < T; t++) rowSquares[t] += centred[from + t] * centred[from + t];
  }
  let fourthMoments = 0;
  for (let t = 0; t < T; t++) fourthMoments += rowSquares[t] * rowSquares[t];

  const betaBar = (fourthMoments / T - squaredEntries) / (n * T);
  const delta = (squaredEntries - 2 * mu * trace + n * mu * mu) / n;
  const beta = Math.min(betaBar, delta);
  const shrinkage = beta === 0 ? 0 : beta / delta;
  for (let k = 0; k < S.length; k++) S[k] *= 1 - shrinkage;
  for (let i = 0; i < n; i++) S[i * n + i] += shrinkage * mu;
  return { covariance: S, shrinkage, mu };
}

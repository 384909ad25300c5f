import type { TimeSeries } from "./time-series.js";

/** Co-activity of spike trains, and the channels whose tiles leave no time uncovered. */
export interface SpikeTiling {
  /** n × n row-major, symmetric, in [−1, 1]; 1 on the diagonal. */
  values: Float64Array;
  /** Channels whose spikes, widened by ±window, cover every time bin (T_A = 1): see spikeTilingMatrix. */
  fullCoverage: number[];
}

/**
 * The spike time tiling coefficient between every pair of binned spike trains (C. S. Cutts, S. J. Eglen,
 * "Detecting pairwise correlations in spike trains: an objective comparison of methods and application to
 * the study of retinal waves", J. Neuroscience 34(43), 2014):
 *   STTC = ½ [ (P_A − T_B) / (1 − P_A·T_B) + (P_B − T_A) / (1 − P_B·T_A) ],
 * where T_A is the fraction of the recording's time bins within ±window bins of a spike of A (A's tiles),
 * and P_A the fraction of A's spikes that fall in B's tiles. It counts coincidences within the window and
 * normalises them by what the firing rates alone would give, so it does not grow with the rates; it is 1 for
 * a train with itself and near 0 for independent trains. Values are spike counts per bin (0, 1, 2, …; a bin
 * of count k is k spikes in it). When a term's denominator is 0 (B's tiles cover the whole recording, so
 * every spike of A coincides trivially) the term is taken as 0: no evidence either way. Every channel
 * must have at least one spike and at least one empty bin (checked by the caller: constant channels).
 */
export function spikeTilingMatrix(series: TimeSeries, window: number): SpikeTiling {
  const { channels: n, timePoints: T, values } = series;
  // tiles[t·n + c] = 1 when bin t lies within ±window of a spike of channel c (time-major, so the inner
  // loop over channels below reads one contiguous row).
  const tiles = new Uint8Array(T * n);
  const coverage = new Float64Array(n);
  const spikes = new Float64Array(n);
  for (let c = 0; c < n; c++) {
    const from = c * T;
    let last = -Infinity;
    for (let t = 0; t < T; t++) {
      if (values[from + t] > 0) {
        last = t;
        spikes[c] += values[from + t];
      }
      if (t - last <= window) tiles[t * n + c] = 1;
    }
    let next = Infinity;
    for (let t = T - 1; t >= 0; t--) {
      if (values[from + t] > 0) next = t;
      if (next - t <= window) tiles[t * n + c] = 1;
    }
    let covered = 0;
    for (let t = 0; t < T; t++) covered += tiles[t * n + c];
    coverage[c] = covered / T;
  }
  // P[a·n + b]: the fraction of a's spikes inside b's tiles.
  const P = new Float64Array(n * n);
  for (let a = 0; a < n; a++) {
    const from = a * T;
    const row = a * n;
    for (let t = 0; t < T; t++) {
      const count = values[from + t];
      if (count === 0) continue;
      const tileRow = t * n;
      for (let b = 0; b < n; b++) P[row + b] += count * tiles[tileRow + b];
    }
    for (let b = 0; b < n; b++) P[row + b] /= spikes[a];
  }
  const term = (p: number, t: number) => (1 - p * t === 0 ? 0 : (p - t) / (1 - p * t));
  const sttc = new Float64Array(n * n);
  for (let a = 0; a < n; a++) {
    sttc[a * n + a] = 1;
    for (let b = a + 1; b < n; b++) {
      const s = 0.5 * (term(P[a * n + b], coverage[b]) + term(P[b * n + a], coverage[a]));
      sttc[a * n + b] = sttc[b * n + a] = s;
    }
  }
  const fullCoverage: number[] = [];
  for (let c = 0; c < n; c++) if (coverage[c] === 1) fullCoverage.push(c);
  return { values: sttc, fullCoverage };
}

/**
 * The first finite value that is not a spike count (a whole number ≥ 0), as [channel, time], or null.
 * NaN and infinity are missing values, left to the channel check (which can isolate their channel).
 */
export function firstNonCount(series: TimeSeries): [number, number] | null {
  const { channels: n, timePoints: T, values } = series;
  for (let c = 0; c < n; c++) {
    for (let t = 0; t < T; t++) {
      const x = values[c * T + t];
      if (Number.isFinite(x) && !(x >= 0 && Number.isInteger(x))) return [c, t];
    }
  }
  return null;
}

/**
 * Connectivity measures against general-purpose libraries (Debian's python3-numpy, python3-scipy,
 * python3-sklearn), run by test/support/python/connectivity.py on the same seeded recordings:
 * - Pearson equals numpy.corrcoef, Spearman equals scipy.stats.spearmanr (average ranks for ties), to 1e-12;
 * - the Ledoit–Wolf covariance and its shrinkage equal sklearn.covariance.LedoitWolf's to 1e-10, and the
 *   partial correlations equal −P_ij / sqrt(P_ii P_jj) of sklearn's precision_ to 1e-10, also with fewer
 *   time points than channels (where the sample covariance is singular and shrinkage is the point);
 * - each lag of the lagged cross-correlation equals numpy.corrcoef(x[i, :-lag], x[j, lag:]), and the arc
 *   keeps the lag of largest |r|.
 */
import {
  laggedCrossCorrelation,
  ledoitWolfCovariance,
  pearsonMatrix,
  shrinkagePartialCorrelation,
  spearmanMatrix,
  type TimeSeries,
} from "@cliquescape/core";
import { describe, expect, it } from "vitest";
import { missingPythonModules, runPythonScript } from "../support/python.js";
import { seededRandom, standardNormal } from "../support/random.js";

const missing = missingPythonModules(["numpy", "scipy", "sklearn"]);

interface Reference {
  pearson: number[][];
  spearman: number[][];
  ledoitWolf: { covariance: number[][]; precision: number[][]; shrinkage: number; partial: number[][] };
  lagged: Record<string, number[][]>;
}

/**
 * Channels mixing three shared latent signals (some with negative loadings) plus their own noise, with
 * offsets and scales that differ per channel: correlations of every sign and size, as in real recordings.
 * `round` rounds to that many decimals, which makes ties.
 */
function recording(channels: number, timePoints: number, seed: number, round?: number): TimeSeries {
  const random = seededRandom(seed);
  const latent = Array.from({ length: 3 }, () =>
    Array.from({ length: timePoints }, () => standardNormal(random)),
  );
  const values = new Float64Array(channels * timePoints);
  for (let c = 0; c < channels; c++) {
    const loadings = latent.map(() => 2 * random() - 1);
    const offset = 100 * (random() - 0.5);
    const scale = 0.5 + 3 * random();
    for (let t = 0; t < timePoints; t++) {
      let x = standardNormal(random);
      loadings.forEach((l, k) => {
        x += 1.5 * l * latent[k][t];
      });
      let v = offset + scale * x;
      if (round !== undefined) v = Math.round(v * 10 ** round) / 10 ** round;
      values[c * timePoints + t] = v;
    }
  }
  return { channels, timePoints, values };
}

function reference(series: TimeSeries, lags: number[] = []): Reference {
  const rows = Array.from({ length: series.channels }, (_, c) =>
    Array.from(series.values.subarray(c * series.timePoints, (c + 1) * series.timePoints)),
  );
  return runPythonScript<Reference>("connectivity.py", { series: rows, lags });
}

/** Largest absolute difference between a row-major matrix and nested rows. */
function maxDifference(ours: ArrayLike<number>, theirs: number[][]): number {
  const n = theirs.length;
  let worst = 0;
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) worst = Math.max(worst, Math.abs(ours[i * n + j] - theirs[i][j]));
  }
  return worst;
}

const CASES = [
  { name: "12 channels × 300 time points", series: () => recording(12, 300, 11) },
  { name: "40 channels × 30 time points (fewer points than channels)", series: () => recording(40, 30, 12) },
  {
    name: "9 channels × 500 points rounded to 1 decimal (many ties)",
    series: () => recording(9, 500, 13, 1),
  },
];

describe.skipIf(missing !== null).each(CASES)(
  `$name${missing ? ` (skipped: ${missing})` : ""}`,
  ({ series: make }) => {
    const series = make();
    const ref = reference(series, [1, 2, 5]);

    it("Pearson equals numpy.corrcoef to 1e-12", () => {
      expect(maxDifference(pearsonMatrix(series), ref.pearson)).toBeLessThan(1e-12);
    });

    it("Spearman equals scipy.stats.spearmanr to 1e-12", () => {
      expect(maxDifference(spearmanMatrix(series), ref.spearman)).toBeLessThan(1e-12);
    });

    it("Ledoit–Wolf covariance and shrinkage equal sklearn.covariance.LedoitWolf to 1e-10", () => {
      const lw = ledoitWolfCovariance(series);
      expect(Math.abs(lw.shrinkage - ref.ledoitWolf.shrinkage)).toBeLessThan(1e-10);
      expect(lw.shrinkage).toBeGreaterThan(0);
      expect(maxDifference(lw.covariance, ref.ledoitWolf.covariance)).toBeLessThan(1e-10);
    });

    it("partial correlations equal −P_ij / sqrt(P_ii P_jj) of sklearn's precision_ to 1e-10", () => {
      const partial = shrinkagePartialCorrelation(series);
      expect(partial).not.toBeNull();
      expect(maxDifference(partial!.values, ref.ledoitWolf.partial)).toBeLessThan(1e-10);
    });

    it("lagged cross-correlation: each arc is numpy.corrcoef(x[i, :-lag], x[j, lag:]) at the lag of largest |r|", () => {
      const n = series.channels;
      const { values, lags } = laggedCrossCorrelation(series, 5);
      // Lags 1, 2 and 5 are computed by numpy; the arc's value must equal numpy's at its own lag whenever
      // that lag is one of them, and be at least as large in |r| as numpy's at all three.
      let checked = 0;
      for (let i = 0; i < n; i++) {
        for (let j = 0; j < n; j++) {
          if (i === j) continue;
          const k = i * n + j;
          for (const lag of [1, 2, 5]) {
            const theirs = ref.lagged[String(lag)][i][j];
            expect(Math.abs(values[k])).toBeGreaterThanOrEqual(Math.abs(theirs) - 1e-12);
            if (lags[k] === lag) {
              expect(Math.abs(values[k] - theirs)).toBeLessThan(1e-12);
              checked++;
            }
          }
        }
      }
      expect(checked).toBeGreaterThan(0);
      // With maxLag 1 the arc is exactly numpy's lag-1 value.
      const one = laggedCrossCorrelation(series, 1).values;
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) if (i === j) ref.lagged["1"][i][j] = 0;
      expect(maxDifference(one, ref.lagged["1"])).toBeLessThan(1e-12);
    });
  },
);

import { type ChannelIssue, channelIssues } from "./channel-issues.js";
import { fisherZ, perfectCorrelation } from "./fisher-z.js";
import { laggedCrossCorrelation } from "./lagged-cross-correlation.js";
import { shrinkagePartialCorrelation } from "./partial-correlation.js";
import { pearsonMatrix } from "./pearson.js";
import { spearmanMatrix } from "./spearman.js";
import { firstNonCount, spikeTilingMatrix } from "./spike-tiling.js";
import { channelName, type TimeSeries } from "./time-series.js";
import { TimeSeriesError } from "./time-series-error.js";

export const CONNECTIVITY_MEASURES = ["pearson", "spearman", "partial", "lagged", "coactivity"] as const;
/**
 * pearson, spearman: correlation; partial: partial correlation from the Ledoit–Wolf shrunk covariance;
 * lagged: directed lagged cross-correlation; coactivity: spike time tiling coefficient of spike trains.
 */
export type ConnectivityMeasure = (typeof CONNECTIVITY_MEASURES)[number];

/** What to do with channels that have non-finite values or no variation. */
export type BadChannelPolicy = "error" | "isolate";

export interface ConnectivityOptions {
  measure: ConnectivityMeasure;
  /** Fisher's z = atanh(r) of every off-diagonal value; correlation measures only. Default false. */
  fisherZ?: boolean;
  /** lagged: the longest lag tried, in time points (lags 1..maxLag). Required for lagged. */
  maxLag?: number;
  /** coactivity: the coincidence window, ± this many time bins. Required for coactivity. */
  window?: number;
  /**
   * "error" (default): refuse the recording, naming the bad channels. "isolate": compute the measure on the
   * other channels and keep the bad ones as nodes without edges, with a warning.
   */
  badChannels?: BadChannelPolicy;
}

/** A connectivity matrix ready to become a network. */
export interface Connectivity {
  n: number;
  /**
   * n × n row-major. The diagonal is 0 and isolated channels' rows and columns are 0: a network has no
   * self-loops, and an isolated channel no edges (see `isolated`). Never NaN.
   */
  values: Float64Array;
  /** Lagged cross-correlation gives arcs i → j; the other measures are symmetric. */
  directed: boolean;
  labels?: readonly string[];
  /** Channels kept as nodes without edges (badChannels "isolate"). */
  isolated: number[];
  /** Notes for the user: isolated channels, fewer time points than channels, windows that cover everything. */
  warnings: string[];
  /** partial: the Ledoit–Wolf shrinkage weight. */
  shrinkage?: number;
  /** lagged: n × n, the lag of each arc in time points (0 on the diagonal and for isolated channels). */
  lags?: Int32Array;
}

/** Time points a measure needs at the least (lagged: beyond the longest lag). */
const MIN_POINTS = 3;

/**
 * The connectivity matrix of one recording under one measure, with its quality checked first: a channel
 * with NaN or infinite values or without variation makes correlations undefined, so it is refused (with
 * every such channel named) or isolated, never passed on as NaN. Throws TimeSeriesError for problems of the
 * data and RangeError for bad options.
 */
export function connectivityMatrix(series: TimeSeries, options: ConnectivityOptions): Connectivity {
  checkConnectivityOptions(options);
  const { measure } = options;
  const { channels: n, timePoints: T } = series;
  if (n < 2) {
    throw new TimeSeriesError(
      "too-few-channels",
      `a network needs at least 2 channels; the recording has ${n}`,
    );
  }
  const needed = measure === "lagged" ? (options.maxLag as number) + MIN_POINTS : MIN_POINTS;
  if (T < needed) {
    const why =
      measure === "lagged"
        ? `lagged correlation up to lag ${options.maxLag} needs at least ${needed} (${MIN_POINTS} beyond the longest lag)`
        : `the ${measure} measure needs at least ${needed}`;
    throw new TimeSeriesError("too-few-points", `only ${T} time point${T === 1 ? "" : "s"}; ${why}`);
  }
  if (measure === "coactivity") {
    const bad = firstNonCount(series);
    if (bad) {
      const [c, t] = bad;
      throw new TimeSeriesError(
        "not-spike-count",
        `${channelName(series, c)} holds ${series.values[c * T + t]} at time point ${t}: coactivity reads spike counts per time bin (0, 1, 2, …)`,
        { channel: c, time: t },
      );
    }
  }
  const issues = channelIssues(series);
  const warnings: string[] = [];
  if (issues.length > 0 && (options.badChannels ?? "error") === "error") {
    const first = issues[0];
    throw new TimeSeriesError(
      first.kind === "constant" ? "constant-channel" : "not-finite",
      `${describeIssues(series, issues, measure)}; ${measure === "coactivity" ? "the tiling coefficient" : "a correlation"} with such a channel is undefined. Fix or leave out the channel, or isolate it (bad-channel policy "isolate": the node stays, without edges)`,
      first.kind === "constant" ? { channel: first.channel } : { channel: first.channel, time: first.time },
    );
  }
  const isolated = issues.map((issue) => issue.channel);
  for (const issue of issues) {
    warnings.push(`${describeIssues(series, [issue], measure)}: isolated (no edges)`);
  }
  const kept = keptChannels(n, isolated);
  if (kept.length < 2) {
    throw new TimeSeriesError(
      "too-few-channels",
      `only ${kept.length} of ${n} channels can be used (the others are isolated); a network needs at least 2`,
    );
  }
  const sub = kept.length === n ? series : selectChannels(series, kept);
  if (T < n && measure !== "partial" && measure !== "coactivity") {
    warnings.push(
      `${n} channels but only ${T} time points: the ${measure} matrix is rank-deficient (rank at most ${T - 1}), its entries noisy; the shrinkage partial correlation (measure "partial") is the estimator made for fewer time points than channels`,
    );
  }

  const result = computeMeasure(sub, options, warnings);
  let values = result.values;
  const m = kept.length;
  if (options.fisherZ) {
    const pair = perfectCorrelation(values, m);
    if (pair) {
      const [a, b] = pair.map((k) => kept[k]);
      throw new TimeSeriesError(
        "perfect-correlation",
        `${channelName(series, a)} and ${channelName(series, b)} correlate perfectly (${values[pair[0] * m + pair[1]]}): Fisher's z would be infinite; is one a copy of the other?`,
        { channel: a },
      );
    }
    values = fisherZ(values, m);
  }
  const out: Connectivity = {
    n,
    values: embed(values, kept, n),
    directed: measure === "lagged",
    isolated,
    warnings,
  };
  if (series.labels) out.labels = series.labels;
  if (result.shrinkage !== undefined) out.shrinkage = result.shrinkage;
  if (result.lags) out.lags = embedLags(result.lags, kept, n);
  return out;
}

/** Throws a RangeError when the options do not fit the measure (a missing maxLag or window, a misplaced one). */
export function checkConnectivityOptions(options: ConnectivityOptions): void {
  const { measure, maxLag, window } = options;
  if (!(CONNECTIVITY_MEASURES as readonly string[]).includes(measure)) {
    throw new RangeError(`unknown measure "${measure}"; choose ${CONNECTIVITY_MEASURES.join(", ")}`);
  }
  const got = (value: unknown) => (value === undefined ? "" : ` (got ${value})`);
  if (measure === "lagged" && !(Number.isInteger(maxLag) && (maxLag as number) >= 1)) {
    throw new RangeError(
      `lagged correlation needs maxLag: the longest lag, a whole number of time points ≥ 1${got(maxLag)}`,
    );
  }
  if (measure !== "lagged" && maxLag !== undefined) {
    throw new RangeError(`maxLag goes with the lagged measure, not ${measure}`);
  }
  if (measure === "coactivity" && !(Number.isInteger(window) && (window as number) >= 0)) {
    throw new RangeError(
      `coactivity needs window: coincidences count within ± this many time bins, a whole number ≥ 0${got(window)}`,
    );
  }
  if (measure !== "coactivity" && window !== undefined) {
    throw new RangeError(`window goes with the coactivity measure, not ${measure}`);
  }
  if (measure === "coactivity" && options.fisherZ) {
    throw new RangeError("fisherZ applies to correlations; the spike time tiling coefficient is not one");
  }
}

function computeMeasure(
  series: TimeSeries,
  options: ConnectivityOptions,
  warnings: string[],
): { values: Float64Array; shrinkage?: number; lags?: Int32Array } {
  switch (options.measure) {
    case "pearson":
      return { values: pearsonMatrix(series) };
    case "spearman":
      return { values: spearmanMatrix(series) };
    case "partial": {
      const partial = shrinkagePartialCorrelation(series);
      if (!partial) {
        throw new TimeSeriesError(
          "singular-covariance",
          "the shrunk covariance is singular (the estimated shrinkage is 0 and the channels are linearly dependent); no partial correlation exists",
        );
      }
      return partial;
    }
    case "lagged":
      return laggedCrossCorrelation(series, options.maxLag as number);
    case "coactivity": {
      const tiling = spikeTilingMatrix(series, options.window as number);
      for (const c of tiling.fullCoverage) {
        warnings.push(
          `${channelName(series, c)}: its spikes widened by ±${options.window} bins cover every bin, so its coincidences tell nothing (its tiling terms are 0); a smaller window would`,
        );
      }
      return tiling;
    }
  }
}

function describeIssues(series: TimeSeries, issues: readonly ChannelIssue[], measure: string): string {
  const shown = issues.slice(0, 8).map((issue) => {
    const name = channelName(series, issue.channel);
    if (issue.kind === "not-finite") return `${name} holds ${issue.value} at time point ${issue.time}`;
    return measure === "coactivity" && issue.value === 0
      ? `${name} has no spikes`
      : `${name} is constant (every value ${issue.value})`;
  });
  const more = issues.length > shown.length ? ` and ${issues.length - shown.length} more channels` : "";
  return `${shown.join("; ")}${more}`;
}

function keptChannels(n: number, isolated: readonly number[]): number[] {
  const out = new Set(isolated);
  return Array.from({ length: n }, (_, c) => c).filter((c) => !out.has(c));
}

function selectChannels(series: TimeSeries, kept: readonly number[]): TimeSeries {
  const T = series.timePoints;
  const values = new Float64Array(kept.length * T);
  kept.forEach((c, k) => {
    values.set(series.values.subarray(c * T, (c + 1) * T), k * T);
  });
  const labels = series.labels && kept.map((c) => series.labels![c]);
  return labels
    ? { channels: kept.length, timePoints: T, values, labels }
    : { channels: kept.length, timePoints: T, values };
}

/** The m × m matrix of the kept channels placed in an n × n matrix of zeros, diagonal 0. */
function embed(values: Float64Array, kept: readonly number[], n: number): Float64Array {
  const m = kept.length;
  const out = new Float64Array(n * n);
  for (let a = 0; a < m; a++) {
    for (let b = 0; b < m; b++) if (a !== b) out[kept[a] * n + kept[b]] = values[a * m + b];
  }
  return out;
}

function embedLags(lags: Int32Array, kept: readonly number[], n: number): Int32Array {
  const m = kept.length;
  const out = new Int32Array(n * n);
  for (let a = 0; a < m; a++) for (let b = 0; b < m; b++) out[kept[a] * n + kept[b]] = lags[a * m + b];
  return out;
}

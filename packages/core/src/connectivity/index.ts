export { type ChannelIssue, channelIssues } from "./channel-issues.js";
export {
  type BadChannelPolicy,
  CONNECTIVITY_MEASURES,
  type Connectivity,
  type ConnectivityMeasure,
  type ConnectivityOptions,
  checkConnectivityOptions,
  connectivityMatrix,
} from "./connectivity-matrix.js";
export { fisherZ, perfectCorrelation } from "./fisher-z.js";
export { invertPositiveDefinite } from "./invert-positive-definite.js";
export { type LaggedCrossCorrelation, laggedCrossCorrelation } from "./lagged-cross-correlation.js";
export { ledoitWolfCovariance, type ShrunkCovariance } from "./ledoit-wolf.js";
export {
  partialCorrelationFromPrecision,
  type ShrinkagePartialCorrelation,
  shrinkagePartialCorrelation,
} from "./partial-correlation.js";
export { pearsonMatrix } from "./pearson.js";
export { spearmanMatrix } from "./spearman.js";
export { firstNonCount, type SpikeTiling, spikeTilingMatrix } from "./spike-tiling.js";
export { channelName, fromTimeByChannel, type TimeSeries } from "./time-series.js";
export { TimeSeriesError, type TimeSeriesLocation, type TimeSeriesProblem } from "./time-series-error.js";

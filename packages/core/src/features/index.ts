export { axisLabels } from "./axis-labels.js";
export { type BarSummary, persistenceEntropy, summarizeBars } from "./bar-summary.js";
export { type CurveSummary, summarizeCurve } from "./curve-summary.js";
export { axisGrid, checkFeatureAxis, type FeatureAxis } from "./feature-axis.js";
export {
  type BarcodeRange,
  checkFeatureConfig,
  DEFAULT_FEATURE_CONFIG,
  DEFAULT_VECTORISATION,
  type FeatureConfig,
  type FeatureFamilies,
  type VectorisationConfig,
  vectorisationOf,
} from "./feature-config.js";
export {
  axisSuffixes,
  BAR_STATISTICS,
  CURVE_KIND_NAMES,
  CURVE_STATISTICS,
  curveNames,
  topologicalFeatureNames,
} from "./feature-names.js";
export {
  edgeFeatureNames,
  type NodeEdgeFeatureOptions,
  type NodeEdgeFeatures,
  nodeEdgeFeatures,
  nodeFeatureNames,
} from "./node-edge-features.js";
export {
  checkNullScoreConfig,
  NULL_SCORE_FEATURES,
  type NullScoreConfig,
  type NullScoreFeature,
  type NullScoreFeatureOptions,
  type NullScoreThreshold,
  nullScoreNames,
  nullScoreValues,
} from "./null-score-features.js";
export {
  type TopologicalFeatureOptions,
  type TopologicalFeatures,
  topologicalFeatures,
} from "./topological-features.js";

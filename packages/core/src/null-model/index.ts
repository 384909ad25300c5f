export { type RewiredGraph, type RewireOptions, rewireDegreePreserving } from "./degree-preserving-rewire.js";
export { erdosRenyiSample } from "./erdos-renyi.js";
export { type NullFeatureOptions, nullFeatureNames, nullFeatures } from "./null-features.js";
export {
  NULL_MODELS,
  type NullModel,
  type NullSample,
  type NullSampleOptions,
  nullSample,
  rewiringStrata,
} from "./null-sample.js";
export { type NullSampleBlock, nullSampleBlock } from "./null-sample-block.js";
export { compareSampleTable, type NullScoreOptions, type NullScores, nullScores } from "./null-scores.js";
export { compareWithNull, type NullComparison } from "./null-statistics.js";
export { type SampleRandom, sampleRandom } from "./sample-random.js";
export { shuffleWeights } from "./shuffle-weights.js";

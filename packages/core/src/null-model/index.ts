export { type RewiredGraph, type RewireOptions, rewireDegreePreserving } from "./degree-preserving-rewire.js";
export { erdosRenyiSample } from "./erdos-renyi.js";
export { type NullFeatureOptions, nullFeatureNames, nullFeatures } from "./null-features.js";
export {
  NULL_MODELS,
  type NullModel,
  type NullSample,
  type NullSampleOptions,
  nullSample,
} from "./null-sample.js";
export { compareWithNull, type NullComparison } from "./null-statistics.js";
export { type SampleRandom, sampleRandom } from "./sample-random.js";
export { shuffleWeights } from "./shuffle-weights.js";

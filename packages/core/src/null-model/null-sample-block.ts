import type { WeightedGraph } from "../graph/weighted-graph.js";
import { type NullFeatureOptions, nullFeatures } from "./null-features.js";
import { type NullSampleOptions, nullSample } from "./null-sample.js";

/** The features of a run of consecutive null samples. */
export interface NullSampleBlock {
  /** Row-major (to − from) × features, rows in sample order, columns as nullFeatureNames. */
  readonly values: Float64Array;
  /** Rewiring: swaps done and refused over the block; 0 for the other models. */
  readonly swaps: number;
  readonly refused: number;
}

/**
 * Draws null samples from..to−1 of `graph` (nullSample) and measures each (nullFeatures). Every sample has
 * its own seeded stream, so blocks may be drawn on any thread in any order and put together by `from`.
 * `afterEach` runs after every sample (a clock check, a progress count).
 */
export function nullSampleBlock(
  graph: WeightedGraph,
  from: number,
  to: number,
  sampling: NullSampleOptions,
  features: NullFeatureOptions,
  afterEach?: (samplesDone: number) => void,
): NullSampleBlock {
  let values = new Float64Array(0);
  let swaps = 0;
  let refused = 0;
  for (let s = from; s < to; s++) {
    const sample = nullSample(graph, s, sampling);
    swaps += sample.swaps;
    refused += sample.refused;
    const row = nullFeatures(sample.graph, features);
    if (s === from) values = new Float64Array((to - from) * row.length);
    values.set(row, (s - from) * row.length);
    afterEach?.(s - from + 1);
  }
  return { values, swaps, refused };
}

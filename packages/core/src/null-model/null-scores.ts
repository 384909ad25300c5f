import type { WeightedGraph } from "../graph/weighted-graph.js";
import type { WorkControl } from "../work/work-control.js";
import { WorkMonitor } from "../work/work-monitor.js";
import { type NullFeatureOptions, nullFeatureNames, nullFeatures } from "./null-features.js";
import type { NullSampleOptions } from "./null-sample.js";
import { nullSampleBlock } from "./null-sample-block.js";
import { compareWithNull, type NullComparison } from "./null-statistics.js";

export interface NullScoreOptions {
  readonly sampling: NullSampleOptions;
  /** What is measured on the graph and on every sample (its `work` is ignored: see `work` here). */
  readonly features: NullFeatureOptions;
  /** Number of null samples, drawn as samples 0 … samples − 1 of the seed. */
  readonly samples: number;
  /** One time limit for the graph and all its samples; progress counts samples drawn. */
  readonly work?: WorkControl;
}

export interface NullScores {
  /** nullFeatureNames(topDim). */
  readonly names: string[];
  /** One per name: observed value, null mean and sd, z-score, empirical p-values. */
  readonly comparisons: NullComparison[];
  /** Rewiring: swaps done and refused over all samples. */
  readonly swaps: number;
  readonly refused: number;
}

/**
 * A graph's features (nullFeatures) against `samples` null samples of it, in one thread: the same numbers
 * `cliquescape nullmodel` reports for the same graph, model, seed and sample count, whichever way its
 * samples were spread over workers (each sample is seeded on its own; columns are compared in sample order).
 */
export function nullScores(graph: WeightedGraph, options: NullScoreOptions): NullScores {
  const { samples } = options;
  if (!Number.isInteger(samples) || samples < 1)
    throw new RangeError(`null samples must be a whole number ≥ 1, got ${samples}`);
  const startedAt = options.work?.startedAt ?? Date.now();
  const monitor = new WorkMonitor({ ...options.work, startedAt });
  // The inner computations share the clock but not the progress line, which counts samples.
  const limit = options.work?.timeLimitMs;
  const features: NullFeatureOptions = {
    ...options.features,
    work: limit === undefined ? { startedAt } : { startedAt, timeLimitMs: limit },
  };
  monitor.begin("drawing null samples", 0, samples);
  const observed = nullFeatures(graph, features);
  const block = nullSampleBlock(graph, 0, samples, options.sampling, features, (done) => monitor.check(done));
  return {
    names: nullFeatureNames(options.features.topDim),
    comparisons: compareSampleTable(observed, block.values),
    swaps: block.swaps,
    refused: block.refused,
  };
}

/**
 * compareWithNull for every feature: `observed` has one value per feature, `values` is row-major
 * samples × features.
 */
export function compareSampleTable(observed: Float64Array, values: Float64Array): NullComparison[] {
  const F = observed.length;
  const N = F === 0 ? 0 : values.length / F;
  const column = new Float64Array(N);
  const comparisons: NullComparison[] = [];
  for (let f = 0; f < F; f++) {
    for (let s = 0; s < N; s++) column[s] = values[s * F + f];
    comparisons.push(compareWithNull(observed[f], column));
  }
  return comparisons;
}

import { explicitGrid, type ThresholdGrid } from "../filtration/threshold-grid.js";
import type { WeightedGraph } from "../graph/weighted-graph.js";
import { rewireDegreePreserving } from "./degree-preserving-rewire.js";
import { erdosRenyiSample } from "./erdos-renyi.js";
import { sampleRandom } from "./sample-random.js";
import { shuffleWeights } from "./shuffle-weights.js";

/** The null models: Erdős–Rényi at the same density, degree-preserving rewiring, weight shuffling. */
export const NULL_MODELS = ["er", "rewire", "shuffle"] as const;
export type NullModel = (typeof NULL_MODELS)[number];

export interface NullSampleOptions {
  readonly model: NullModel;
  readonly seed: number;
  /** Rewiring: swap attempts per edge (default 10). */
  readonly swapsPerEdge?: number;
  /** Rewiring: keep degrees at every threshold of this grid too (see rewireDegreePreserving). */
  readonly grid?: ThresholdGrid;
}

export interface NullSample {
  readonly graph: WeightedGraph;
  /** Rewiring only: swaps done and refused; 0 for the other models. */
  readonly swaps: number;
  readonly refused: number;
}

/**
 * Sample number `sample` of a null model of `graph`. Each sample has its own random stream derived from
 * (seed, sample), so samples are the same whichever worker draws them, in any order, on any machine.
 */
export function nullSample(graph: WeightedGraph, sample: number, options: NullSampleOptions): NullSample {
  const random = sampleRandom(options.seed, sample);
  switch (options.model) {
    case "er":
      return { graph: erdosRenyiSample(graph, random), swaps: 0, refused: 0 };
    case "shuffle":
      return { graph: shuffleWeights(graph, random), swaps: 0, refused: 0 };
    case "rewire":
      return rewireDegreePreserving(graph, random, {
        swapsPerEdge: options.swapsPerEdge,
        grid: options.grid,
      });
    default:
      throw new RangeError(
        `unknown null model "${options.model as string}"; choose from ${NULL_MODELS.join(", ")}`,
      );
  }
}

/**
 * The strata rewiring keeps degrees in when features are read at `threshold` and over `grid`: the grid's
 * thresholds and that threshold together, so every degree the features see is the graph's own. Undefined
 * (the whole graph is one stratum) when there are none.
 */
export function rewiringStrata(
  grid: ThresholdGrid,
  threshold: number | undefined,
): ThresholdGrid | undefined {
  const values = [...grid.thresholds, ...(threshold === undefined ? [] : [threshold])];
  return values.length > 0 ? explicitGrid(values, grid.semantics) : undefined;
}

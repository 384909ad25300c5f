import { densityGrid } from "../filtration/threshold-grid.js";
import type { WeightSemantics } from "../filtration/weight-semantics.js";
import type { WeightedGraph } from "../graph/weighted-graph.js";
import type { HomologyBudget } from "../homology/homology-budget.js";
import { NULL_MODELS, type NullModel, rewiringStrata } from "../null-model/null-sample.js";
import { nullScores } from "../null-model/null-scores.js";
import type { WorkControl } from "../work/work-control.js";
import { axisGrid, type FeatureAxis } from "./feature-axis.js";
import { axisSuffixes } from "./feature-names.js";

/** The features a null model can score, in column order. */
export const NULL_SCORE_FEATURES = ["simplices", "betti", "bettiAreas"] as const;
export type NullScoreFeature = (typeof NULL_SCORE_FEATURES)[number];

/** Where simplex counts and Betti numbers are read: every edge, a weight, or an edge density of each graph. */
export type NullScoreThreshold =
  | { readonly kind: "all" }
  | { readonly kind: "weight"; readonly value: number }
  | { readonly kind: "density"; readonly value: number };

/** z-scored columns: which null model, how many samples from which seed, which features. */
export interface NullScoreConfig {
  readonly model: NullModel;
  readonly samples: number;
  /** Every graph draws samples 0 … samples − 1 of this seed. */
  readonly seed: number;
  /** Listed features get columns; the order of the list does not matter. */
  readonly features: readonly NullScoreFeature[];
  readonly threshold: NullScoreThreshold;
  /** Rewiring: swap attempts per edge (default 10). */
  readonly swapsPerEdge?: number;
}

export interface NullScoreFeatureOptions {
  readonly config: NullScoreConfig;
  /** Simplices counted to topDim; Betti numbers of dimensions 0 … topDim − 1. */
  readonly topDim: number;
  readonly prime?: number;
  /** The dataset-wide axis Betti-curve areas are taken over (as the `betti_d{k}_area` columns). */
  readonly axis: FeatureAxis;
  readonly semantics: WeightSemantics;
  readonly countBudget?: number;
  readonly homologyBudget?: HomologyBudget;
  /** One time limit for the graph and all its samples; progress counts samples drawn. */
  readonly work?: WorkControl;
}

/**
 * Names of the z-scored columns, in the order nullScoreValues fills them; they depend on the configuration
 * and topDim only: `z_{model}_simplices_d{k}_{at}` (k = 1 … topDim), `z_{model}_betti_d{k}_{at}` and
 * `z_{model}_betti_d{k}_area` (k = 0 … topDim − 1), where `{at}` is `all`, `w{weight}` or `dens{density}`.
 */
export function nullScoreNames(config: NullScoreConfig, topDim: number): string[] {
  checkNullScoreConfig(config);
  const t = config.threshold;
  const at = t.kind === "all" ? "all" : axisSuffixes({ kind: t.kind, values: [t.value] })[0];
  const prefix = `z_${config.model}`;
  const names: string[] = [];
  if (config.features.includes("simplices"))
    for (let k = 1; k <= topDim; k++) names.push(`${prefix}_simplices_d${k}_${at}`);
  if (config.features.includes("betti"))
    for (let k = 0; k < topDim; k++) names.push(`${prefix}_betti_d${k}_${at}`);
  if (config.features.includes("bettiAreas"))
    for (let k = 0; k < topDim; k++) names.push(`${prefix}_betti_d${k}_area`);
  return names;
}

/**
 * z-scores of one graph's simplex counts and Betti numbers at the configured threshold and of its
 * Betti-curve areas over the axis, against `samples` samples of the null model (nullScores), aligned with
 * nullScoreNames. A density threshold and a density axis are resolved on the graph and those weights are
 * used for every sample; rewiring keeps degrees at all of them. NaN where every sample gave the same value
 * (no spread: z is undefined).
 */
export function nullScoreValues(graph: WeightedGraph, options: NullScoreFeatureOptions): Float64Array {
  const { config, topDim, semantics, axis } = options;
  checkNullScoreConfig(config);
  const t = config.threshold;
  const threshold =
    t.kind === "all"
      ? undefined
      : t.kind === "weight"
        ? t.value
        : densityGrid(graph, [t.value], semantics).thresholds[0];
  const grid = axisGrid(graph, axis, semantics);
  const scores = nullScores(graph, {
    sampling: {
      model: config.model,
      seed: config.seed,
      swapsPerEdge: config.swapsPerEdge,
      grid: rewiringStrata(grid, threshold),
    },
    features: {
      semantics,
      threshold,
      grid,
      areaPositions: axis.values,
      topDim,
      prime: options.prime,
      countBudget: options.countBudget,
      homologyBudget: options.homologyBudget,
    },
    samples: config.samples,
    work: options.work,
  });
  // nullFeatureNames: simplices_d0 … d{topDim}, betti_d0 … d{topDim−1}, betti_d0_area … .
  const picked: number[] = [];
  if (config.features.includes("simplices")) for (let k = 1; k <= topDim; k++) picked.push(k);
  if (config.features.includes("betti")) for (let k = 0; k < topDim; k++) picked.push(topDim + 1 + k);
  if (config.features.includes("bettiAreas"))
    for (let k = 0; k < topDim; k++) picked.push(2 * topDim + 1 + k);
  return Float64Array.from(picked, (i) => scores.comparisons[i].z ?? Number.NaN);
}

/** Throws a RangeError naming the first setting that cannot be used. */
export function checkNullScoreConfig(config: NullScoreConfig): void {
  if (!(NULL_MODELS as readonly string[]).includes(config.model))
    throw new RangeError(`unknown null model "${config.model}"; choose from ${NULL_MODELS.join(", ")}`);
  if (!Number.isInteger(config.samples) || config.samples < 2)
    throw new RangeError(
      `null samples must be a whole number ≥ 2 (a z-score needs a spread), got ${config.samples}`,
    );
  if (!Number.isSafeInteger(config.seed) || config.seed < 0)
    throw new RangeError(`the null-model seed must be a whole number ≥ 0, got ${config.seed}`);
  for (const f of config.features)
    if (!(NULL_SCORE_FEATURES as readonly string[]).includes(f))
      throw new RangeError(
        `unknown null-model feature "${f}"; choose from ${NULL_SCORE_FEATURES.join(", ")}`,
      );
  const t = config.threshold;
  if (t.kind === "density" && !(t.value >= 0 && t.value <= 1))
    throw new RangeError(`the null-model density ${t.value} is outside [0, 1]`);
  if (t.kind === "weight" && !Number.isFinite(t.value))
    throw new RangeError(`the null-model threshold must be a finite weight, got ${t.value}`);
  const swaps = config.swapsPerEdge ?? 10;
  if (!(swaps >= 0 && Number.isFinite(swaps)))
    throw new RangeError(`swapsPerEdge must be a number ≥ 0, got ${swaps}`);
}

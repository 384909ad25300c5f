import { sweepSimplexCounts } from "../count/sweep-simplex-counts.js";
import type { SweepCounts } from "../count/types.js";
import type { ThresholdGrid } from "../filtration/threshold-grid.js";
import type { WeightSemantics } from "../filtration/weight-semantics.js";
import { thresholdSubgraph } from "../graph/threshold-subgraph.js";
import type { WeightedGraph } from "../graph/weighted-graph.js";
import type { Barcode } from "../homology/barcode.js";
import { bettiCurves } from "../homology/betti-curves.js";
import { computeBarcode } from "../homology/compute-barcode.js";
import type { HomologyBudget } from "../homology/homology-budget.js";
import type { WorkControl } from "../work/work-control.js";
import { summarizeBars } from "./bar-summary.js";
import { summarizeCurve } from "./curve-summary.js";
import { axisGrid, type FeatureAxis } from "./feature-axis.js";
import { checkFeatureConfig, type FeatureConfig, needsBarcode, needsSweep } from "./feature-config.js";
import { vectorisationValues } from "./vectorisation-values.js";

export interface TopologicalFeatureOptions {
  readonly config: FeatureConfig;
  /** The dataset-wide axis; the same for every graph. */
  readonly axis: FeatureAxis;
  readonly semantics: WeightSemantics;
  /** Simplex budget of the count sweep (see CountOptions.budget). */
  readonly countBudget?: number;
  /** Memory budget of the barcode computation. */
  readonly homologyBudget?: HomologyBudget;
  /** Time limit and progress, shared by the sweep and the barcode (give it a startedAt). */
  readonly work?: WorkControl;
}

export interface TopologicalFeatures {
  /** One value per name of topologicalFeatureNames(config, axis), same order. */
  readonly values: Float64Array;
  /** The weight thresholds this graph was read at, one per axis value (density axes differ per graph). */
  readonly grid: ThresholdGrid;
  /**
   * The barcode behind Betti curves and bar summaries (dimensions 0..topDim−1), or null when not needed. With
   * barcodeRange "axis" it is the barcode of the graph kept at the axis's last threshold.
   */
  readonly barcode: Barcode | null;
  /**
   * True when the graph has simplices above topDim at the last threshold: counts up to topDim are still
   * exact, but the Euler characteristic is then the partial sum Σ_{k ≤ topDim} (−1)^k c_k. Null when no
   * family needed the count sweep.
   */
  readonly truncated: boolean | null;
}

/**
 * The topological feature row of one graph: one count sweep over the axis (sweepSimplexCounts, simplices
 * up to topDim) gives the simplex-count and Euler curves; one barcode (computeBarcode, homology up to
 * topDim−1) gives the Betti curves (bettiCurves) and the bar summaries. Families that are off cost nothing.
 */
export function topologicalFeatures(
  graph: WeightedGraph,
  options: TopologicalFeatureOptions,
): TopologicalFeatures {
  const { config, axis, semantics } = options;
  checkFeatureConfig(config);
  const { families, topDim } = config;
  const grid = axisGrid(graph, axis, semantics);
  const T = grid.thresholds.length;

  const sweep: SweepCounts | null = needsSweep(config)
    ? sweepSimplexCounts(graph, grid, { ...options.work, maxDim: topDim, budget: options.countBudget })
    : null;
  // The barcode of the filtration up to the axis end (thresholds are in filtration order) unless asked for
  // the whole of it: dense graphs hold most of their simplices beyond the thresholds people read.
  let barcode: Barcode | null = null;
  if (needsBarcode(config)) {
    const upToAxisEnd = (config.barcodeRange ?? "axis") === "axis";
    barcode = computeBarcode(
      upToAxisEnd ? thresholdSubgraph(graph, grid.thresholds[T - 1], semantics) : graph,
      {
        ...options.work,
        semantics,
        maxDim: topDim - 1,
        prime: config.prime,
        budget: options.homologyBudget,
      },
    );
  }

  // Curves as one row-major table [curve][t], in the order of curveNames(config).
  const curveCount = 2 * topDim + 1;
  const curves = new Float64Array(curveCount * T);
  if (sweep) {
    for (let t = 0; t < T; t++) {
      const counts = sweep.counts[t];
      // Dimensions above the largest simplex present are absent from `counts`: zero.
      for (let k = 1; k <= topDim; k++) curves[(k - 1) * T + t] = k < counts.length ? counts[k] : 0;
      curves[topDim * T + t] = sweep.euler[t];
    }
  }
  if (barcode) {
    const betti = bettiCurves(barcode, grid);
    for (let t = 0; t < T; t++)
      for (let k = 0; k < topDim; k++) curves[(topDim + 1 + k) * T + t] = betti[t][k];
  }

  const values: number[] = [];
  const pushCurve = (index: number) => {
    for (let t = 0; t < T; t++) values.push(curves[index * T + t]);
  };
  if (families.simplexCounts) for (let k = 1; k <= topDim; k++) pushCurve(k - 1);
  if (families.euler) pushCurve(topDim);
  if (families.betti) for (let k = 0; k < topDim; k++) pushCurve(topDim + 1 + k);
  if (families.curveSummaries) {
    for (let c = 0; c < curveCount; c++) {
      const s = summarizeCurve(curves, axis.values, 1, c * T);
      values.push(s.max, s.peakAt, s.area);
    }
  }
  if (families.barcodeSummaries && barcode) {
    for (let k = 0; k < topDim; k++) {
      const s = summarizeBars(barcode, k);
      values.push(s.count, s.essential, s.totalPersistence, s.maxPersistence, s.entropy);
    }
  }
  if (barcode) vectorisationValues(graph, barcode, options, values);
  return {
    values: Float64Array.from(values),
    grid,
    barcode,
    truncated: sweep ? sweep.truncated : null,
  };
}

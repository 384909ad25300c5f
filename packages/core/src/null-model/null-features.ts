import { countSimplices } from "../count/count-simplices.js";
import { summarizeCurve } from "../features/curve-summary.js";
import type { ThresholdGrid } from "../filtration/threshold-grid.js";
import { toFiltrationValue, type WeightSemantics } from "../filtration/weight-semantics.js";
import { thresholdSubgraph } from "../graph/threshold-subgraph.js";
import type { WeightedGraph } from "../graph/weighted-graph.js";
import { bettiCurves, bettiFromBarcode } from "../homology/betti-curves.js";
import { computeBarcode } from "../homology/compute-barcode.js";
import type { HomologyBudget } from "../homology/homology-budget.js";
import type { WorkControl } from "../work/work-control.js";

export interface NullFeatureOptions {
  readonly semantics: WeightSemantics;
  /** Where counts and Betti numbers are read (user units); undefined: every edge. */
  readonly threshold?: number;
  /** The grid Betti-curve areas are taken over. */
  readonly grid: ThresholdGrid;
  /**
   * Where each grid threshold sits on the x-axis of the area, one per threshold; default the thresholds
   * themselves (the area in weight units). extract passes its axis values, so on a density axis the area
   * is over densities, as its own `betti_d{k}_area` column.
   */
  readonly areaPositions?: ArrayLike<number>;
  /** Simplices counted to this dimension; Betti numbers to topDim − 1. */
  readonly topDim: number;
  readonly prime?: number;
  readonly countBudget?: number;
  readonly homologyBudget?: HomologyBudget;
  /** Time limit shared by the count and the barcode (give it a startedAt). */
  readonly work?: WorkControl;
}

/** Names of the values nullFeatures returns, in order. */
export function nullFeatureNames(topDim: number): string[] {
  const names: string[] = [];
  for (let k = 0; k <= topDim; k++) names.push(`simplices_d${k}`);
  for (let k = 0; k < topDim; k++) names.push(`betti_d${k}`);
  for (let k = 0; k < topDim; k++) names.push(`betti_d${k}_area`);
  return names;
}

/**
 * The numbers a null model is asked about, for one graph: simplex counts per dimension and Betti numbers at
 * the threshold, and the area under each Betti curve over the grid (trapezoid rule, as summarizeCurve).
 * One count and one barcode (of the filtration up to the later of the threshold and the grid's end).
 */
export function nullFeatures(graph: WeightedGraph, options: NullFeatureOptions): Float64Array {
  const { semantics, threshold, grid, topDim } = options;
  const positions = options.areaPositions ?? grid.thresholds;
  if (positions.length !== grid.thresholds.length)
    throw new RangeError(`${positions.length} area positions for ${grid.thresholds.length} thresholds`);
  const counts = countSimplices(graph, {
    ...options.work,
    threshold,
    semantics,
    maxDim: topDim,
    budget: options.countBudget,
  });
  const gridEnd = grid.thresholds[grid.thresholds.length - 1];
  const end =
    threshold === undefined
      ? undefined
      : toFiltrationValue(threshold, semantics) >= toFiltrationValue(gridEnd, semantics)
        ? threshold
        : gridEnd;
  const barcode = computeBarcode(end === undefined ? graph : thresholdSubgraph(graph, end, semantics), {
    ...options.work,
    semantics,
    maxDim: topDim - 1,
    prime: options.prime,
    budget: options.homologyBudget,
  });
  const values = new Float64Array(3 * topDim + 1);
  for (let k = 0; k <= topDim; k++) values[k] = k < counts.counts.length ? counts.counts[k] : 0;
  const betti = threshold === undefined ? bettiOfAll(barcode, topDim) : bettiFromBarcode(barcode, threshold);
  for (let k = 0; k < topDim; k++) values[topDim + 1 + k] = betti[k];
  const curves = bettiCurves(barcode, grid);
  const T = curves.length;
  const curve = new Float64Array(T);
  for (let k = 0; k < topDim; k++) {
    for (let t = 0; t < T; t++) curve[t] = curves[t][k];
    values[2 * topDim + 1 + k] = summarizeCurve(curve, positions).area;
  }
  return values;
}

/** Betti numbers with every edge in: the essential bars of each dimension. */
function bettiOfAll(barcode: ReturnType<typeof computeBarcode>, topDim: number): number[] {
  const betti = new Array<number>(topDim).fill(0);
  for (const bar of barcode.bars) if (bar.death === null && bar.dim < topDim) betti[bar.dim]++;
  return betti;
}

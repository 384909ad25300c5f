import { densityGrid, type ThresholdGrid } from "../filtration/threshold-grid.js";
import { toFiltrationValue, type WeightSemantics } from "../filtration/weight-semantics.js";
import type { WeightedGraph } from "../graph/weighted-graph.js";

/**
 * The dataset-wide axis feature curves are read on, as the user chose it: weight thresholds (user units,
 * filtration order: ascending for distances, descending for similarities) or edge densities (ascending,
 * in [0, 1]). Column names come from these values, so every graph of a dataset shares them.
 */
export interface FeatureAxis {
  readonly kind: "weight" | "density";
  readonly values: readonly number[];
}

/**
 * Throws a RangeError unless the axis has at least one value, all finite and strictly increasing along the
 * filtration (weights) or strictly ascending within [0, 1] (densities). Repeats would give two columns
 * with the same meaning.
 */
export function checkFeatureAxis(axis: FeatureAxis, semantics: WeightSemantics): void {
  const { kind, values } = axis;
  if (kind !== "weight" && kind !== "density") throw new RangeError(`unknown axis kind "${kind}"`);
  if (values.length === 0) throw new RangeError("the feature axis has no values");
  let previous = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < values.length; i++) {
    const x = values[i];
    if (!Number.isFinite(x)) throw new RangeError(`axis value ${i} is not a finite number (${x})`);
    if (kind === "density" && !(x >= 0 && x <= 1)) throw new RangeError(`density ${x} is outside [0, 1]`);
    const order = kind === "weight" ? toFiltrationValue(x, semantics) : x;
    if (!(order > previous)) {
      const direction =
        kind === "density" ? "ascending" : semantics === "distance" ? "ascending" : "descending";
      throw new RangeError(`axis values must be strictly ${direction} without repeats (value ${i}: ${x})`);
    }
    previous = order;
  }
}

/**
 * The weight thresholds at which one graph is read, one per axis value and in axis order. A weight axis
 * is used as it is. A density axis gets this graph's thresholds from proportional thresholding
 * (densityGrid). densityGrid drops repeated thresholds; when two densities keep the same edges, each
 * density is looked up on its own instead, so the grid repeats that threshold and the columns stay aligned
 * with the axis.
 */
export function axisGrid(graph: WeightedGraph, axis: FeatureAxis, semantics: WeightSemantics): ThresholdGrid {
  checkFeatureAxis(axis, semantics);
  if (axis.kind === "weight") return { semantics, thresholds: Float64Array.from(axis.values) };
  // Ascending densities give thresholds in filtration order, so without repeats the grid is in axis order.
  const together = densityGrid(graph, axis.values, semantics);
  if (together.thresholds.length === axis.values.length) return together;
  const thresholds = Float64Array.from(axis.values, (d) => densityGrid(graph, [d], semantics).thresholds[0]);
  return { semantics, thresholds };
}

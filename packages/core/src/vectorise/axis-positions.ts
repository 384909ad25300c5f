import { checkFeatureAxis, type FeatureAxis } from "../features/feature-axis.js";
import { countAtMost } from "../filtration/count-at-most.js";
import { distinctEdgeFiltration } from "../filtration/threshold-grid.js";
import { toFiltrationValue, type WeightSemantics } from "../filtration/weight-semantics.js";
import { possibleEdgeCount, type WeightedGraph } from "../graph/weighted-graph.js";

/** Where a graph's weights fall along the dataset's feature axis. */
export interface AxisPositions {
  /** Position of a weight (user units): 0 at the axis's first value, increasing as edges enter. */
  readonly position: (weight: number) => number;
  /** Positions of the axis values themselves (ascending, from 0). */
  readonly samples: Float64Array;
  /** Position of the axis's last value. */
  readonly span: number;
}

/**
 * Positions along the axis, in the axis's own unit so that every graph's vectorisations share one grid:
 * - a weight axis: the filtration-order distance from the first value, f(w) − f(a₀) with f = w for
 *   distances and −w for similarities (weight units);
 * - a density axis: the edge density at which the weight is reached in this graph, minus the first density:
 *   (number of edges with f ≤ f(w)) / possible edges − d₀.
 */
export function axisPositions(
  graph: WeightedGraph,
  axis: FeatureAxis,
  semantics: WeightSemantics,
): AxisPositions {
  checkFeatureAxis(axis, semantics);
  const values = axis.values;
  if (axis.kind === "weight") {
    const origin = toFiltrationValue(values[0], semantics);
    const position = (w: number) => toFiltrationValue(w, semantics) - origin;
    const samples = Float64Array.from(values, position);
    return { position, samples, span: samples[samples.length - 1] };
  }
  const once = distinctEdgeFiltration(graph, semantics);
  const possible = possibleEdgeCount(graph.n, graph.directed);
  const origin = values[0];
  const position = (w: number) => {
    if (possible === 0) return -origin;
    const x = toFiltrationValue(w, semantics);
    return countAtMost(once, x) / possible - origin;
  };
  const samples = Float64Array.from(values, (d) => d - origin);
  return { position, samples, span: samples[samples.length - 1] };
}

import { edgeCount, possibleEdgeCount, type WeightedGraph } from "../graph/weighted-graph.js";
import { edgeFiltration } from "./edge-filtration.js";
import { fromFiltrationValue, toFiltrationValue, type WeightSemantics } from "./weight-semantics.js";

/**
 * Weight thresholds at which a filtration is read. Thresholds are in the user's units and in filtration
 * order: ascending for distances, descending for similarities. Results at threshold i count everything
 * whose filtration value is ≤ that of threshold i.
 */
export interface ThresholdGrid {
  readonly semantics: WeightSemantics;
  readonly thresholds: Float64Array;
}

/** The grid's thresholds as ascending filtration values. */
export function gridFiltrationValues(grid: ThresholdGrid): Float64Array {
  return grid.thresholds.map((t) => toFiltrationValue(t, grid.semantics));
}

/** A grid of the given thresholds, put in filtration order with repeats removed. */
export function explicitGrid(values: ArrayLike<number>, semantics: WeightSemantics): ThresholdGrid {
  const f = Float64Array.from(values, (t) => {
    if (Number.isNaN(t)) throw new RangeError("a threshold is NaN");
    return toFiltrationValue(t, semantics);
  }).sort();
  const unique = f.filter((x, i) => i === 0 || x !== f[i - 1]);
  return { semantics, thresholds: unique.map((x) => fromFiltrationValue(x, semantics)) };
}

/** `count` evenly spaced thresholds from `first` to `last` inclusive (either order). */
export function evenGrid(
  first: number,
  last: number,
  count: number,
  semantics: WeightSemantics,
): ThresholdGrid {
  if (!Number.isInteger(count) || count < 1)
    throw new RangeError(`grid size must be a positive integer, got ${count}`);
  if (!Number.isFinite(first) || !Number.isFinite(last)) throw new RangeError("grid ends must be finite");
  const values = new Float64Array(count);
  for (let i = 0; i < count; i++) values[i] = first + ((last - first) * i) / Math.max(1, count - 1);
  // Pin the ends exactly: rounding must not leave the last edge just outside the grid.
  values[0] = count === 1 ? last : first;
  values[count - 1] = last;
  return explicitGrid(values, semantics);
}

/**
 * Proportional thresholding: for each density d in [0, 1], the threshold that keeps the strongest
 * round(d · possible edges) edges (possible = n(n−1)/2 undirected, n(n−1) directed). The threshold is the
 * weight of the last edge kept, so edges tied with it are kept too. When fewer edges exist than asked for,
 * the threshold keeps every edge. Density 0 gives a threshold just before the first edge.
 */
export function densityGrid(
  graph: WeightedGraph,
  densities: ArrayLike<number>,
  semantics: WeightSemantics,
): ThresholdGrid {
  const sorted = distinctEdgeFiltration(graph, semantics);
  const possible = possibleEdgeCount(graph.n, graph.directed);
  const values = Array.from(densities, (d) => {
    if (!(d >= 0 && d <= 1)) throw new RangeError(`density must be in [0, 1], got ${d}`);
    const keep = Math.round(d * possible);
    if (sorted.length === 0) return 0;
    const f = keep === 0 ? previousFloat(sorted[0]) : sorted[Math.min(keep, sorted.length) - 1];
    return fromFiltrationValue(f, semantics);
  });
  return explicitGrid(values, semantics);
}

/** One threshold at which every edge of the graph is present (the weakest edge's weight; 0 if none). */
export function allEdgesGrid(graph: WeightedGraph, semantics: WeightSemantics): ThresholdGrid {
  const sorted = distinctEdgeFiltration(graph, semantics);
  const f = sorted.length === 0 ? 0 : sorted[sorted.length - 1];
  return { semantics, thresholds: Float64Array.of(fromFiltrationValue(f, semantics)) };
}

/** Filtration values of the edges, one per edge (not per stored slot), ascending. */
export function distinctEdgeFiltration(graph: WeightedGraph, semantics: WeightSemantics): Float64Array {
  const f = edgeFiltration(graph, semantics);
  if (graph.directed) return f.sort();
  const once = new Float64Array(edgeCount(graph));
  let k = 0;
  for (let u = 0; u < graph.n; u++) {
    for (let s = graph.offsets[u]; s < graph.offsets[u + 1]; s++) if (graph.targets[s] > u) once[k++] = f[s];
  }
  return once.sort();
}

function previousFloat(x: number): number {
  if (x === 0) return -Number.MIN_VALUE;
  const buffer = new Float64Array([x]);
  const bits = new BigInt64Array(buffer.buffer);
  bits[0] += x > 0 ? -1n : 1n;
  return buffer[0];
}

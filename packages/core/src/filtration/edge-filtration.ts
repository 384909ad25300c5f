import type { WeightedGraph } from "../graph/weighted-graph.js";
import type { WeightSemantics } from "./weight-semantics.js";

/** Filtration value of every stored edge slot, aligned with `graph.targets`. */
export function edgeFiltration(graph: WeightedGraph, semantics: WeightSemantics): Float64Array {
  const f = new Float64Array(graph.weights.length);
  if (semantics === "distance") f.set(graph.weights);
  else for (let i = 0; i < f.length; i++) f[i] = -graph.weights[i];
  return f;
}

/**
 * Filtration value at which every vertex is born: 0 for distances (or the smallest weight when some are
 * negative), the largest weight for similarities. Graphs without edges start at 0.
 */
export function filtrationStart(graph: WeightedGraph, semantics: WeightSemantics): number {
  const w = graph.weights;
  if (w.length === 0) return 0;
  if (semantics === "distance") {
    let min = 0;
    for (let i = 0; i < w.length; i++) if (w[i] < min) min = w[i];
    return min;
  }
  let max = -Infinity;
  for (let i = 0; i < w.length; i++) if (w[i] > max) max = w[i];
  return -max;
}

import type { WeightedGraph } from "@cliquescape/core";

/** Each edge's weight once (undirected edges are stored in both rows), in CSR order. */
export function edgeValues(graph: WeightedGraph): Float64Array {
  if (graph.directed) return Float64Array.from(graph.weights);
  const once = new Float64Array(graph.weights.length / 2);
  let k = 0;
  for (let u = 0; u < graph.n; u++) {
    for (let s = graph.offsets[u]; s < graph.offsets[u + 1]; s++) {
      if (graph.targets[s] > u) once[k++] = graph.weights[s];
    }
  }
  return once;
}

import { edgeCount, type WeightedGraph } from "./weighted-graph.js";

/** A graph's edges as parallel typed arrays, each undirected edge once (source < target), in row order. */
export interface EdgeArrays {
  readonly sources: Int32Array;
  readonly targets: Int32Array;
  readonly weights: Float64Array;
}

export function edgeArrays(graph: WeightedGraph): EdgeArrays {
  const m = edgeCount(graph);
  const sources = new Int32Array(m);
  const targets = new Int32Array(m);
  const weights = new Float64Array(m);
  let e = 0;
  for (let u = 0; u < graph.n; u++) {
    for (let s = graph.offsets[u]; s < graph.offsets[u + 1]; s++) {
      const v = graph.targets[s];
      if (!graph.directed && v < u) continue;
      sources[e] = u;
      targets[e] = v;
      weights[e++] = graph.weights[s];
    }
  }
  return { sources, targets, weights };
}

import { toFiltrationValue, type WeightSemantics } from "../filtration/weight-semantics.js";
import type { WeightedGraph } from "./weighted-graph.js";

/**
 * The graph at one threshold: the same nodes, only the edges present there (w ≤ W for distances,
 * w ≥ W for similarities). Rows stay sorted, so the result is a valid CSR graph.
 */
export function thresholdSubgraph(
  graph: WeightedGraph,
  threshold: number,
  semantics: WeightSemantics,
): WeightedGraph {
  const limit = toFiltrationValue(threshold, semantics);
  const { n, offsets, targets, weights } = graph;
  const keep = (w: number) => toFiltrationValue(w, semantics) <= limit;
  let kept = 0;
  for (let s = 0; s < weights.length; s++) if (keep(weights[s])) kept++;
  const outOffsets = new Int32Array(n + 1);
  const outTargets = new Int32Array(kept);
  const outWeights = new Float64Array(kept);
  let k = 0;
  for (let u = 0; u < n; u++) {
    for (let s = offsets[u]; s < offsets[u + 1]; s++) {
      if (!keep(weights[s])) continue;
      outTargets[k] = targets[s];
      outWeights[k++] = weights[s];
    }
    outOffsets[u + 1] = k;
  }
  return {
    n,
    directed: graph.directed,
    offsets: outOffsets,
    targets: outTargets,
    weights: outWeights,
    labels: graph.labels,
  };
}

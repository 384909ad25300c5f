import { edgeArrays } from "../graph/edge-arrays.js";
import { fromEdgeList } from "../graph/from-edge-list.js";
import type { WeightedGraph } from "../graph/weighted-graph.js";
import type { SampleRandom } from "./sample-random.js";

/**
 * The same edges with their weights randomly permuted (Fisher–Yates shuffle; R. A. Fisher, F. Yates, 1938,
 * in R. Durstenfeld's form, 1964): the graph and the multiset of weights are kept, which edge enters the
 * filtration when is not.
 */
export function shuffleWeights(graph: WeightedGraph, random: SampleRandom): WeightedGraph {
  const edges = edgeArrays(graph);
  const weights = edges.weights.slice();
  for (let i = weights.length - 1; i > 0; i--) {
    const j = random.below(i + 1);
    const w = weights[i];
    weights[i] = weights[j];
    weights[j] = w;
  }
  return fromEdgeList({
    n: graph.n,
    sources: edges.sources,
    targets: edges.targets,
    weights,
    directed: graph.directed,
    labels: graph.labels,
    negative: "keep",
  });
}

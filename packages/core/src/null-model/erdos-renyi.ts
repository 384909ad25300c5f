import { edgeArrays } from "../graph/edge-arrays.js";
import { fromEdgeList } from "../graph/from-edge-list.js";
import { density, type WeightedGraph } from "../graph/weighted-graph.js";
import type { SampleRandom } from "./sample-random.js";

/**
 * An Erdős–Rényi graph G(n, p) with the graph's node count and density p (directed: each ordered pair
 * an arc with probability p; undirected: each pair an edge), P. Erdős, A. Rényi, "On random graphs I", 1959
 * and E. N. Gilbert, 1959. Edge weights are drawn with replacement from the graph's own weights, so the
 * weight distribution (and so a threshold's expected density) is kept while every structure is destroyed.
 * The number of edges is random, binomial with mean p · possible edges.
 */
export function erdosRenyiSample(graph: WeightedGraph, random: SampleRandom): WeightedGraph {
  const { n, directed } = graph;
  const observed = edgeArrays(graph).weights;
  // p as an integer threshold on 32 random bits: the comparison is exact on every machine.
  const cut = Math.round(density(graph) * 2 ** 32);
  const sources: number[] = [];
  const targets: number[] = [];
  const weights: number[] = [];
  for (let u = 0; u < n; u++) {
    for (let v = directed ? 0 : u + 1; v < n; v++) {
      if (u === v || random.uint32() >= cut) continue;
      sources.push(u);
      targets.push(v);
      weights.push(observed[random.below(observed.length)]);
    }
  }
  return fromEdgeList({ n, sources, targets, weights, directed, labels: graph.labels, negative: "keep" });
}

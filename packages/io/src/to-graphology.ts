import type { WeightedGraph } from "@cliquescape/core";
import { DirectedGraph, UndirectedGraph } from "graphology";

export interface ToGraphologyOptions {
  /**
   * Node keys: the graph's labels ("labels", the default when it has them, so fromGraphology gives the same
   * graph back) or the node indices as strings ("index").
   */
  readonly keys?: "labels" | "index";
}

/**
 * The graph as a graphology Graph: directed or undirected as the input, one edge per stored edge (an
 * undirected edge once) with its weight in the `weight` attribute, nodes in index order. Repeated labels
 * cannot be keys; use `keys: "index"` for such graphs.
 */
export function toGraphology(
  graph: WeightedGraph,
  options: ToGraphologyOptions = {},
): DirectedGraph | UndirectedGraph {
  const { n, directed, offsets, targets, weights, labels } = graph;
  const useLabels = labels !== undefined && (options.keys ?? "labels") === "labels";
  const keys = useLabels ? labels : Array.from({ length: n }, (_, v) => String(v));
  const settings = { multi: false, allowSelfLoops: false };
  const out = directed ? new DirectedGraph(settings) : new UndirectedGraph(settings);
  for (const key of keys) {
    if (out.hasNode(key)) throw new RangeError(`node label "${key}" repeats; convert with keys: "index"`);
    out.addNode(key);
  }
  for (let u = 0; u < n; u++) {
    for (let s = offsets[u]; s < offsets[u + 1]; s++) {
      const v = targets[s];
      if (!directed && v < u) continue; // the other row holds this edge too
      out.addEdge(keys[u], keys[v], { weight: weights[s] });
    }
  }
  return out;
}

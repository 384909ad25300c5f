import type { AbstractGraph, Attributes } from "graphology-types";
import { fromEdgeList } from "./from-edge-list.js";
import { GraphInputError } from "./graph-input-error.js";
import type { NegativePolicy, WarningSink } from "./policies.js";
import type { WeightedGraph } from "./weighted-graph.js";

export interface GraphologyOptions {
  /** Edge attribute holding the weight; edges without it weigh `defaultWeight`. Default "weight". */
  weightAttribute?: string;
  /** Default 1. */
  defaultWeight?: number;
  negative?: NegativePolicy;
  onWarning?: WarningSink;
}

/**
 * Builds a graph from a graphology graph. Node keys become labels, in graphology's node order. Mixed
 * graphs are refused: each of our graphs is either directed or undirected.
 */
export function fromGraphology(
  graph: AbstractGraph<Attributes, Attributes, Attributes>,
  options: GraphologyOptions = {},
): WeightedGraph {
  if (graph.type === "mixed" && graph.directedSize > 0 && graph.undirectedSize > 0) {
    throw new GraphInputError("bad-shape", "graph mixes directed and undirected edges");
  }
  const directed = graph.type === "directed" || (graph.type === "mixed" && graph.directedSize > 0);
  const attribute = options.weightAttribute ?? "weight";
  const fallback = options.defaultWeight ?? 1;
  const labels = graph.nodes();
  const index = new Map<string, number>();
  labels.forEach((key, i) => {
    index.set(key, i);
  });
  const sources: number[] = [];
  const targets: number[] = [];
  const weights: number[] = [];
  graph.forEachEdge((_edge, attributes, source, target) => {
    const raw = attributes[attribute];
    sources.push(index.get(source)!);
    targets.push(index.get(target)!);
    weights.push(raw === undefined ? fallback : Number(raw));
  });
  return fromEdgeList({
    n: labels.length,
    sources,
    targets,
    weights,
    directed,
    labels,
    negative: options.negative,
    onWarning: options.onWarning,
  });
}

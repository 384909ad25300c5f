/** Plain transformations of a `WeightedGraph` used as independent references by the tests. */
import type { WeightedGraph, WeightSemantics } from "@cliquescape/core";
import { type EdgeList, graphOf } from "./known-graphs.js";

/** The graph's edges, each undirected edge once (u < v). */
export function edgesOf(graph: WeightedGraph): EdgeList {
  const edges: EdgeList = { n: graph.n, directed: graph.directed, sources: [], targets: [], weights: [] };
  for (let u = 0; u < graph.n; u++) {
    for (let s = graph.offsets[u]; s < graph.offsets[u + 1]; s++) {
      const v = graph.targets[s];
      if (!graph.directed && v < u) continue;
      edges.sources.push(u);
      edges.targets.push(v);
      edges.weights.push(graph.weights[s]);
    }
  }
  return edges;
}

/** The same graph with vertex v renamed perm[v]. */
export function relabel(graph: WeightedGraph, perm: ArrayLike<number>): WeightedGraph {
  const edges = edgesOf(graph);
  return graphOf({
    ...edges,
    sources: edges.sources.map((u) => perm[u]),
    targets: edges.targets.map((v) => perm[v]),
  });
}

/**
 * The edges present at a weight threshold, filtered here by the rule the issue states (distance: keep
 * w ≤ W; similarity: keep w ≥ W), independently of the core's filtration code.
 */
export function thresholdSubgraph(
  graph: WeightedGraph,
  threshold: number,
  semantics: WeightSemantics,
): WeightedGraph {
  const edges = edgesOf(graph);
  const keep = edges.weights.map((w) => (semantics === "distance" ? w <= threshold : w >= threshold));
  return graphOf({
    ...edges,
    sources: edges.sources.filter((_, e) => keep[e]),
    targets: edges.targets.filter((_, e) => keep[e]),
    weights: edges.weights.filter((_, e) => keep[e]),
  });
}

/** Counts per dimension without trailing zeros, so arrays of different allocated lengths compare. */
export function significant(counts: ArrayLike<number>): number[] {
  const out = Array.from(counts);
  while (out.length > 0 && out[out.length - 1] === 0) out.pop();
  return out;
}

/**
 * Degeneracy of the underlying undirected graph (largest minimum degree over subgraphs), by repeatedly
 * removing a vertex of minimum degree (D. W. Matula and L. L. Beck, J. ACM 30(3), 1983). Quadratic;
 * for test-sized graphs only.
 */
export function degeneracy(graph: WeightedGraph): number {
  const neighbours = Array.from({ length: graph.n }, () => new Set<number>());
  for (let u = 0; u < graph.n; u++) {
    for (let s = graph.offsets[u]; s < graph.offsets[u + 1]; s++) {
      neighbours[u].add(graph.targets[s]);
      neighbours[graph.targets[s]].add(u);
    }
  }
  const alive = new Set(neighbours.keys());
  let result = 0;
  while (alive.size > 0) {
    let v = -1;
    for (const u of alive) if (v < 0 || neighbours[u].size < neighbours[v].size) v = u;
    result = Math.max(result, neighbours[v].size);
    for (const u of neighbours[v]) neighbours[u].delete(v);
    alive.delete(v);
  }
  return result;
}

/** Largest out-degree (directed) or degree (undirected). */
export function maxOutDegree(graph: WeightedGraph): number {
  let max = 0;
  for (let u = 0; u < graph.n; u++) max = Math.max(max, graph.offsets[u + 1] - graph.offsets[u]);
  return max;
}

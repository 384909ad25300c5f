/**
 * The graph every algorithm walks: compressed sparse rows over typed arrays.
 *
 * Row `u` holds the out-neighbours `targets[offsets[u] .. offsets[u+1])`, sorted ascending, with the
 * matching `weights`. An undirected graph stores each edge in both rows, so `targets.length` is twice
 * its edge count. Self-loops are never stored.
 */
export interface WeightedGraph {
  /** Number of nodes; nodes are 0 .. n-1. */
  readonly n: number;
  readonly directed: boolean;
  /** Row starts, length n + 1. */
  readonly offsets: Int32Array;
  /** Column indices, sorted within each row. */
  readonly targets: Int32Array;
  /** Edge weights aligned with `targets`, in the user's units. */
  readonly weights: Float64Array;
  /** Optional node names, length n. */
  readonly labels?: readonly string[];
}

/** Number of edges: arcs for a directed graph, unordered pairs for an undirected one. */
export function edgeCount(graph: WeightedGraph): number {
  return graph.directed ? graph.targets.length : graph.targets.length / 2;
}

/** Possible edges without self-loops: n(n-1) arcs, or n(n-1)/2 pairs. */
export function possibleEdgeCount(n: number, directed: boolean): number {
  return directed ? n * (n - 1) : (n * (n - 1)) / 2;
}

/** Edge density: edges present over possible edges (0 for graphs with fewer than two nodes). */
export function density(graph: WeightedGraph): number {
  const possible = possibleEdgeCount(graph.n, graph.directed);
  return possible === 0 ? 0 : edgeCount(graph) / possible;
}

/** Label of node `v`: its name when the graph has names, else its index. */
export function nodeLabel(graph: WeightedGraph, v: number): string {
  return graph.labels ? graph.labels[v] : String(v);
}

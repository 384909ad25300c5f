import type { WeightedGraph } from "../graph/weighted-graph.js";
import { degeneracyOrder } from "./degeneracy-order.js";

/**
 * The lists the enumerators walk, one per root vertex ("local universes"):
 * - undirected: vertices renumbered in degeneracy order; list r holds the neighbours with a larger number,
 *   ascending, so each clique is found once, from its first vertex;
 * - directed: the out-neighbours of each vertex (original numbering); each directed simplex is found once,
 *   from its source v0.
 * Only edges whose slot passes the mask are kept (mask[slot] >= 0, e.g. a threshold bin).
 */
export interface EnumerationGraph {
  readonly n: number;
  readonly directed: boolean;
  readonly offsets: Int32Array;
  /** Neighbour ids in the enumeration numbering. */
  readonly targets: Int32Array;
  /** CSR slot of each listed edge in the input graph (for bins and edge participation). */
  readonly slots: Int32Array;
  /** vertexOf[id] = input vertex of enumeration id. */
  readonly vertexOf: Int32Array;
  /** Largest list length: the size of the largest local universe. */
  readonly maxList: number;
}

export function buildEnumerationGraph(graph: WeightedGraph, mask: Int32Array | null): EnumerationGraph {
  return graph.directed ? buildDirected(graph, mask) : buildUndirected(graph, mask);
}

function buildDirected(graph: WeightedGraph, mask: Int32Array | null): EnumerationGraph {
  const { n, offsets: off, targets: tgt } = graph;
  const offsets = new Int32Array(n + 1);
  let kept = 0;
  for (let u = 0; u < n; u++) {
    for (let s = off[u]; s < off[u + 1]; s++) if (mask === null || mask[s] >= 0) kept++;
    offsets[u + 1] = kept;
  }
  const targets = new Int32Array(kept);
  const slots = new Int32Array(kept);
  let k = 0;
  let maxList = 0;
  for (let u = 0; u < n; u++) {
    for (let s = off[u]; s < off[u + 1]; s++) {
      if (mask !== null && mask[s] < 0) continue;
      targets[k] = tgt[s];
      slots[k++] = s;
    }
    if (offsets[u + 1] - offsets[u] > maxList) maxList = offsets[u + 1] - offsets[u];
  }
  const vertexOf = new Int32Array(n);
  for (let v = 0; v < n; v++) vertexOf[v] = v;
  return { n, directed: true, offsets, targets, slots, vertexOf, maxList };
}

function buildUndirected(graph: WeightedGraph, mask: Int32Array | null): EnumerationGraph {
  const { n } = graph;
  let off = graph.offsets;
  let tgt = graph.targets;
  let slotOf: Int32Array | null = null;
  if (mask !== null) {
    // the kept subgraph, both directions, remembering input slots
    const o = new Int32Array(n + 1);
    let kept = 0;
    for (let u = 0; u < n; u++) {
      for (let s = off[u]; s < off[u + 1]; s++) if (mask[s] >= 0) kept++;
      o[u + 1] = kept;
    }
    const t = new Int32Array(kept);
    slotOf = new Int32Array(kept);
    let k = 0;
    for (let u = 0; u < n; u++) {
      for (let s = off[u]; s < off[u + 1]; s++) {
        if (mask[s] < 0) continue;
        t[k] = tgt[s];
        slotOf[k++] = s;
      }
    }
    off = o;
    tgt = t;
  }
  const vertexOf = degeneracyOrder(n, off, tgt);
  const rank = new Int32Array(n);
  for (let r = 0; r < n; r++) rank[vertexOf[r]] = r;

  const offsets = new Int32Array(n + 1);
  for (let u = 0; u < n; u++) {
    const ru = rank[u];
    for (let s = off[u]; s < off[u + 1]; s++) if (rank[tgt[s]] > ru) offsets[ru + 1]++;
  }
  let maxList = 0;
  for (let r = 0; r < n; r++) {
    if (offsets[r + 1] > maxList) maxList = offsets[r + 1];
    offsets[r + 1] += offsets[r];
  }
  const targets = new Int32Array(offsets[n]);
  const slots = new Int32Array(offsets[n]);
  const fill = offsets.slice(0, n);
  // Visit the later endpoint in increasing rank: every list receives its entries already sorted.
  for (let r2 = 0; r2 < n; r2++) {
    const v = vertexOf[r2];
    for (let s = off[v]; s < off[v + 1]; s++) {
      const r1 = rank[tgt[s]];
      if (r1 >= r2) continue;
      const p = fill[r1]++;
      targets[p] = r2;
      slots[p] = slotOf === null ? s : slotOf[s];
    }
  }
  return { n, directed: false, offsets, targets, slots, vertexOf, maxList };
}

/** For an undirected graph, the slot holding the same edge in the other endpoint's row. */
export function reverseSlots(graph: WeightedGraph): Int32Array {
  const { n, offsets, targets } = graph;
  const reverse = new Int32Array(targets.length);
  const cursor = offsets.slice(0, n);
  // rows are sorted, so row v lists its smaller neighbours u in the order we visit them
  for (let u = 0; u < n; u++) {
    for (let s = offsets[u]; s < offsets[u + 1]; s++) {
      const v = targets[s];
      if (v <= u) continue;
      const t = cursor[v]++;
      reverse[s] = t;
      reverse[t] = s;
    }
  }
  return reverse;
}

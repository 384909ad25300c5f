import { edgeFiltration } from "../filtration/edge-filtration.js";
import { toFiltrationValue } from "../filtration/weight-semantics.js";
import type { WeightedGraph } from "../graph/weighted-graph.js";
import type { Barcode } from "./barcode.js";

/**
 * A closed edge loop representing the class of a dimension-1 bar, as vertex pairs [u0, v0, u1, v1, …].
 *
 * The loop is the creating edge e = (a, b) followed by a shortest path (fewest edges, breadth-first) from
 * b back to a that uses only edges entering strictly before e in the filtration order. Such a path exists
 * because e did not join two components. Oriented along the walk, the loop is an integer cycle, hence a
 * cycle over every Z/p; every edge is present at the bar's birth. Its class is born exactly when e enters,
 * and it is not a boundary at any threshold before the bar's death. It is the class the bar follows up to
 * classes born earlier (adding an older cycle changes nothing in the barcode; any path through earlier edges
 * gives such a representative, the shortest is chosen). At the death the class becomes a boundary plus
 * older classes, which need not make the loop itself a boundary (the elder rule).
 *
 * For directed graphs each pair is an arc as stored (source, target); the walk may cross arcs backwards.
 * For undirected graphs pairs follow the walk.
 */
export function representativeCycle(graph: WeightedGraph, barcode: Barcode, barIndex: number): Int32Array {
  const bar = barcode.bars[barIndex];
  if (!bar) throw new RangeError(`no bar at index ${barIndex}`);
  if (bar.dim !== 1)
    throw new RangeError(
      `representative loops exist for dimension-1 bars; bar ${barIndex} has dimension ${bar.dim}`,
    );
  if (graph.directed !== barcode.directed)
    throw new RangeError("the graph is not the one the barcode was computed from");
  const [a, b] = bar.birthSimplex;
  const semantics = barcode.semantics;
  const edgeF = edgeFiltration(graph, semantics);
  const birthF = toFiltrationValue(bar.birth, semantics);
  const n = graph.n;
  const { offsets, targets } = graph;

  // Edges (u → v as stored) usable for the path: strictly before e in the order (f, then the tie order).
  const before = (u: number, v: number, f: number): boolean => {
    if (f !== birthF) return f < birthF;
    if (graph.directed) return u < a || (u === a && v < b);
    // Undirected keys order edges by larger endpoint, then smaller (combinatorial number system).
    const hi = Math.max(u, v);
    const lo = Math.min(u, v);
    return hi < b || (hi === b && lo < a);
  };

  // Adjacency for the walk: stored rows, plus reversed arcs when directed.
  const reverse = graph.directed ? reverseRows(graph, edgeF) : null;
  const parent = new Int32Array(n).fill(-1);
  const parentForward = new Uint8Array(n); // 1 when the step used the arc parent → child as stored
  const queue = new Int32Array(n);
  let head = 0;
  let tail = 0;
  queue[tail++] = b;
  parent[b] = b;
  while (head < tail && parent[a] < 0) {
    const x = queue[head++];
    for (let s = offsets[x]; s < offsets[x + 1]; s++) {
      const y = targets[s];
      if (parent[y] >= 0 || !before(x, y, edgeF[s])) continue;
      parent[y] = x;
      parentForward[y] = 1;
      queue[tail++] = y;
    }
    if (reverse) {
      for (let r = reverse.offsets[x]; r < reverse.offsets[x + 1]; r++) {
        const y = reverse.sources[r];
        if (parent[y] >= 0 || !before(y, x, reverse.f[r])) continue;
        parent[y] = x;
        parentForward[y] = 0;
        queue[tail++] = y;
      }
    }
  }
  if (parent[a] < 0) throw new Error("internal: the creating edge's endpoints are not joined before it");
  // The chain a, parent(a), …, b read backwards is the walk b → … → a that closes the loop.
  const chain: number[] = [];
  for (let y = a; y !== b; y = parent[y]) chain.push(y);
  const pairs: number[] = [a, b];
  for (let i = chain.length - 1; i >= 0; i--) {
    const y = chain[i];
    const x = parent[y];
    if (graph.directed && !parentForward[y]) pairs.push(y, x);
    else pairs.push(x, y);
  }
  return Int32Array.from(pairs);
}

/**
 * Indices (into barcode.bars) of the k most persistent bars of a dimension: essential bars first, then by
 * length |death − birth| descending, ties by position in the barcode.
 */
export function mostPersistentBars(barcode: Barcode, dim: number, k: number): number[] {
  const chosen: number[] = [];
  barcode.bars.forEach((bar, i) => {
    if (bar.dim === dim) chosen.push(i);
  });
  const length = (i: number) => {
    const bar = barcode.bars[i];
    return bar.death === null ? Infinity : Math.abs(bar.death - bar.birth);
  };
  chosen.sort((x, y) => {
    const lx = length(x);
    const ly = length(y);
    return lx === ly ? x - y : lx > ly ? -1 : 1;
  });
  return chosen.slice(0, Math.max(0, k));
}

/** In-neighbour rows of a directed graph, with each arc's filtration value. */
function reverseRows(
  graph: WeightedGraph,
  f: Float64Array,
): { offsets: Int32Array; sources: Int32Array; f: Float64Array } {
  const n = graph.n;
  const offsets = new Int32Array(n + 1);
  for (let s = 0; s < graph.targets.length; s++) offsets[graph.targets[s] + 1]++;
  for (let v = 0; v < n; v++) offsets[v + 1] += offsets[v];
  const fill = offsets.slice(0, n);
  const sources = new Int32Array(graph.targets.length);
  const weights = new Float64Array(graph.targets.length);
  for (let u = 0; u < n; u++) {
    for (let s = graph.offsets[u]; s < graph.offsets[u + 1]; s++) {
      const v = graph.targets[s];
      sources[fill[v]] = u;
      weights[fill[v]] = f[s];
      fill[v]++;
    }
  }
  return { offsets, sources, f: weights };
}

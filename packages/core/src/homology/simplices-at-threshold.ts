import type { WeightedGraph } from "../graph/weighted-graph.js";
import { HomologyBudgetError } from "./homology-budget.js";

/**
 * Every simplex of the complex at one threshold, listed explicitly: per dimension, (dim + 1) vertices per
 * simplex, ascending for cliques, the ordered tuple for the directed flag complex. Only edges with
 * filtration value ≤ `limitF` count. Stops with a HomologyBudgetError past `maxBytes`.
 */
export function simplicesAtThreshold(
  graph: WeightedGraph,
  edgeF: Float64Array,
  limitF: number,
  topDim: number,
  maxBytes: number,
): Int32Array[] {
  const n = graph.n;
  const { offsets, targets } = graph;
  // Neighbours kept at this threshold: out-neighbours (directed) or larger neighbours (undirected).
  const rowStart = new Int32Array(n + 1);
  const kept: number[] = [];
  for (let u = 0; u < n; u++) {
    for (let s = offsets[u]; s < offsets[u + 1]; s++) {
      if (edgeF[s] <= limitF && (graph.directed || targets[s] > u)) kept.push(targets[s]);
    }
    rowStart[u + 1] = kept.length;
  }
  const row = Int32Array.from(kept);
  const out: number[][] = [];
  for (let d = 0; d <= topDim; d++) out.push([]);
  let bytes = 0;
  const tuple = new Int32Array(topDim + 1);
  const candidates: Int32Array[] = [];
  let widest = 0;
  for (let u = 0; u < n; u++) widest = Math.max(widest, rowStart[u + 1] - rowStart[u]);
  for (let d = 0; d <= topDim; d++) candidates.push(new Int32Array(widest));

  // candidates[depth] holds vertices adjacent from every vertex of tuple[0 .. depth], ascending.
  const grow = (depth: number, count: number) => {
    const cand = candidates[depth];
    for (let c = 0; c < count; c++) {
      const v = cand[c];
      tuple[depth + 1] = v;
      for (let i = 0; i <= depth + 1; i++) out[depth + 1].push(tuple[i]);
      bytes += 8 * (depth + 2);
      if (bytes > maxBytes)
        throw new HomologyBudgetError("listing simplices at a threshold", bytes, maxBytes);
      if (depth + 1 === topDim) continue;
      const next = candidates[depth + 1];
      let k = 0;
      let q = rowStart[v];
      const end = rowStart[v + 1];
      // Undirected: later candidates only (rows hold larger neighbours). Directed: all candidates.
      for (let c2 = graph.directed ? 0 : c + 1; c2 < count; c2++) {
        const w = cand[c2];
        while (q < end && row[q] < w) q++;
        if (q === end) break;
        if (row[q] === w) next[k++] = w;
      }
      grow(depth + 1, k);
    }
  };
  for (let u = 0; u < n; u++) {
    out[0].push(u);
    tuple[0] = u;
    if (topDim === 0) continue;
    const cand = candidates[0];
    let k = 0;
    for (let q = rowStart[u]; q < rowStart[u + 1]; q++) cand[k++] = row[q];
    grow(0, k);
  }
  return out.map((list) => Int32Array.from(list));
}

/**
 * Complete multipartite graphs and the elementary symmetric polynomials that count their cliques (common
 * practice): a clique takes at most one vertex from each part, so parts of sizes a_1 … a_r give
 * e_{k+1}(a) k-simplices. Used by the counting tests of count/ (bitset-counter, annotated-enumerator).
 */
import { fromEdgeList } from "../../packages/core/src/graph/from-edge-list.js";
import type { WeightedGraph } from "../../packages/core/src/graph/weighted-graph.js";
import { randomPermutation, seededRandom } from "./random.js";

/** "ordered": each edge one arc along a seeded total order; "both": both arcs. */
export type Mode = "undirected" | "ordered" | "both";

export interface Multipartite {
  graph: WeightedGraph;
  sizes: number[];
  /** part[v] of each (relabelled) vertex, and its place in the total order of "ordered" */
  part: Int32Array;
  rank: Int32Array;
}

export interface MultipartiteOptions {
  /** Weight of an edge between parts p < q (default 1). */
  weight?: (p: number, q: number) => number;
  /** One more vertex, n, with a weight-1 edge (arc from it) to every other vertex. */
  apex?: boolean;
}

/** Complete multipartite graph with parts of the given sizes, vertices relabelled by a permutation from `seed`. */
export function multipartite(
  sizes: number[],
  mode: Mode,
  seed: number,
  { weight = () => 1, apex = false }: MultipartiteOptions = {},
): Multipartite {
  const random = seededRandom(seed);
  const partOf = sizes.flatMap((size, i) => Array.from({ length: size }, () => i));
  const n = partOf.length;
  const name = randomPermutation(n, random);
  const rank = randomPermutation(n, random);
  const part = new Int32Array(n);
  for (let u = 0; u < n; u++) part[name[u]] = partOf[u];
  const sources: number[] = [];
  const targets: number[] = [];
  const weights: number[] = [];
  for (let a = 0; a < n; a++) {
    for (let b = a + 1; b < n; b++) {
      if (part[a] === part[b]) continue;
      const w = weight(Math.min(part[a], part[b]), Math.max(part[a], part[b]));
      if (mode === "undirected" || (mode === "ordered" && rank[a] < rank[b])) {
        sources.push(a);
        targets.push(b);
        weights.push(w);
      } else if (mode === "ordered") {
        sources.push(b);
        targets.push(a);
        weights.push(w);
      } else {
        sources.push(a, b);
        targets.push(b, a);
        weights.push(w, w);
      }
    }
  }
  for (let v = 0; apex && v < n; v++) {
    sources.push(n);
    targets.push(v);
    weights.push(1);
  }
  const graph = fromEdgeList({
    n: apex ? n + 1 : n,
    directed: mode !== "undirected",
    sources,
    targets,
    weights,
  });
  return { graph, sizes, part, rank };
}

/** e_0 … e_r of the numbers given (elementary symmetric polynomials, by the usual recurrence). */
export function elementary(values: number[]): number[] {
  const e = [1];
  for (const a of values) {
    e.push(0);
    for (let j = e.length - 1; j >= 1; j--) e[j] += a * e[j - 1];
  }
  return e;
}

import { gridFiltrationValues, type ThresholdGrid } from "../filtration/threshold-grid.js";
import { toFiltrationValue } from "../filtration/weight-semantics.js";
import { edgeArrays } from "../graph/edge-arrays.js";
import { fromEdgeList } from "../graph/from-edge-list.js";
import type { WeightedGraph } from "../graph/weighted-graph.js";
import { EdgeKeySet } from "./edge-key-set.js";
import type { SampleRandom } from "./sample-random.js";

export interface RewireOptions {
  /** Swap attempts per edge (default 10). */
  readonly swapsPerEdge?: number;
  /**
   * When given, only edges entering between the same two consecutive thresholds of the grid are swapped
   * with each other, so every node keeps its degree at every threshold of the grid, not only in the whole
   * graph.
   */
  readonly grid?: ThresholdGrid;
}

export interface RewiredGraph {
  readonly graph: WeightedGraph;
  /** Swaps carried out. */
  readonly swaps: number;
  /** Swap attempts refused: they would have made a self-loop or an edge that exists already. */
  readonly refused: number;
}

/**
 * Degree-preserving randomisation by edge swaps (S. Maslov, K. Sneppen, "Specificity and stability in
 * topology of protein networks", Science 296, 2002): pick two edges a–b and c–d and reconnect them as a–d
 * and c–b (undirected: or a–c and b–d, at random). Directed arcs a→b, c→d become a→d, c→b, so every node
 * keeps its in-degree and its out-degree. A swap that would create a self-loop or a duplicate edge is
 * refused and counted. Each edge keeps its weight as it moves. swapsPerEdge · edges attempts are made.
 */
export function rewireDegreePreserving(
  graph: WeightedGraph,
  random: SampleRandom,
  options: RewireOptions = {},
): RewiredGraph {
  const { n, directed } = graph;
  const { sources, targets, weights } = edgeArrays(graph);
  const sourceOf = sources.slice();
  const targetOf = targets.slice();
  const m = sourceOf.length;
  const attempts = Math.round((options.swapsPerEdge ?? 10) * m);
  if (!(attempts >= 0)) throw new RangeError(`swapsPerEdge must be ≥ 0, got ${options.swapsPerEdge}`);

  // Strata: edges that may be swapped with each other, as index lists.
  const stratum = new Int32Array(m);
  if (options.grid) {
    const gridF = gridFiltrationValues(options.grid);
    for (let e = 0; e < m; e++) {
      const f = toFiltrationValue(weights[e], options.grid.semantics);
      let lo = 0;
      let hi = gridF.length;
      while (lo < hi) {
        const mid = (lo + hi) >>> 1;
        if (gridF[mid] < f) lo = mid + 1;
        else hi = mid;
      }
      stratum[e] = lo; // the first threshold at which the edge is present (gridF.length: never)
    }
  }
  // reduce, not Math.max(...stratum): a graph of a few hundred thousand edges would overflow the call stack.
  const strata = stratum.reduce((most, s) => Math.max(most, s), 0) + 1;
  const start = new Int32Array(strata + 1);
  for (let e = 0; e < m; e++) start[stratum[e] + 1]++;
  for (let s = 0; s < strata; s++) start[s + 1] += start[s];
  const fill = start.slice(0, strata);
  const members = new Int32Array(m);
  for (let e = 0; e < m; e++) members[fill[stratum[e]]++] = e;

  const present = new EdgeKeySet(n, directed, m);
  for (let e = 0; e < m; e++) present.add(sourceOf[e], targetOf[e]);

  let swaps = 0;
  let refused = 0;
  for (let t = 0; t < attempts; t++) {
    const e1 = random.below(m);
    const s = stratum[e1];
    const e2 = members[start[s] + random.below(start[s + 1] - start[s])];
    const a = sourceOf[e1];
    const b = targetOf[e1];
    let c = sourceOf[e2];
    let d = targetOf[e2];
    if (!directed && random.below(2) === 1) {
      const x = c;
      c = d;
      d = x;
    }
    // a–b, c–d → a–d, c–b
    if (e1 === e2 || a === d || c === b || present.has(a, d) || present.has(c, b)) {
      refused++;
      continue;
    }
    present.delete(a, b);
    present.delete(c, d);
    present.add(a, d);
    present.add(c, b);
    sourceOf[e1] = a;
    targetOf[e1] = d;
    sourceOf[e2] = c;
    targetOf[e2] = b;
    swaps++;
  }
  const rewired = fromEdgeList({
    n,
    sources: sourceOf,
    targets: targetOf,
    weights,
    directed,
    labels: graph.labels,
    negative: "keep",
  });
  return { graph: rewired, swaps, refused };
}

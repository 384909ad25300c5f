import { seededRandom } from "./random.js";

/** An edge list as the graph builders take it. */
export interface RandomArcs {
  n: number;
  directed: boolean;
  sources: number[];
  targets: number[];
  weights: number[];
}

/**
 * Each ordered pair u ≠ v (directed; u < v when undirected) is an arc with probability p, of value
 * 1 … levels drawn uniformly: few levels make ties between values common on purpose.
 */
export function randomArcs(
  n: number,
  p: number,
  levels: number,
  seed: number,
  directed: boolean,
): RandomArcs {
  const random = seededRandom(seed);
  const arcs: RandomArcs = { n, directed, sources: [], targets: [], weights: [] };
  for (let u = 0; u < n; u++) {
    for (let v = directed ? 0 : u + 1; v < n; v++) {
      if (u === v || random() >= p) continue;
      arcs.sources.push(u);
      arcs.targets.push(v);
      arcs.weights.push(1 + Math.floor(random() * levels));
    }
  }
  return arcs;
}

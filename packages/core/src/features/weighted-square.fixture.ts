import { fromEdgeList } from "../graph/from-edge-list.js";
import type { WeightedGraph } from "../graph/weighted-graph.js";

/**
 * Test fixture: a square 0-1-2-3 whose sides weigh 1, 2, 3, 4 and whose diagonal 0-2 weighs 5, or the
 * same weights mirrored (6 − w), which enter in the same order under similarity semantics. As distances
 * (hand-computed; common practice): H0 has four components born at 0, three dying at 1, 2, 3; H1 one loop
 * born at 4 with the fourth side and killed at 5 by the diagonal.
 */
export function weightedSquare(mirrored = false): WeightedGraph {
  return fromEdgeList({
    n: 4,
    sources: [0, 1, 2, 3, 0],
    targets: [1, 2, 3, 0, 2],
    weights: mirrored ? [5, 4, 3, 2, 1] : [1, 2, 3, 4, 5],
    directed: false,
  });
}

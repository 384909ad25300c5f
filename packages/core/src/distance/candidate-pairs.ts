import { countBelow } from "../filtration/count-below.js";
import { DEFAULT_DISTANCE_BYTES, DistanceBudgetError } from "./distance-budget-error.js";
import type { PersistenceDiagram } from "./persistence-diagram.js";

/** Pairs (a point of one diagram, a point of the other) that an optimal matching may use, with their cost. */
export interface CandidatePairs {
  readonly count: number;
  readonly left: Int32Array;
  readonly right: Int32Array;
  /** L∞ distance max(|b − b′|, |d − d′|) of the two points. */
  readonly distance: Float64Array;
}

/**
 * The pairs (i, j) whose L∞ distance c satisfies `keep(i, j, c)`, looking only at points j of `b` whose birth
 * is within `reach[i]` of point i's birth (c ≥ |b_i − b_j|, so pairs beyond that reach cannot be kept).
 * Points of `b` are visited in birth order through a binary search, so short bars far apart are never
 * compared: the diagrams of real barcodes are mostly such bars. Throws DistanceBudgetError when the pairs
 * would take more than `maxBytes`.
 */
export function candidatePairs(
  a: PersistenceDiagram,
  b: PersistenceDiagram,
  reach: Float64Array,
  keep: (i: number, j: number, c: number) => boolean,
  maxBytes: number = DEFAULT_DISTANCE_BYTES,
): CandidatePairs {
  const m = b.births.length;
  const order = new Int32Array(m);
  for (let j = 0; j < m; j++) order[j] = j;
  order.sort((x, y) => b.births[x] - b.births[y]);
  const sortedBirths = Float64Array.from(order, (j) => b.births[j]);
  let left = new Int32Array(64);
  let right = new Int32Array(64);
  let distance = new Float64Array(64);
  let count = 0;
  for (let i = 0; i < a.births.length; i++) {
    const bi = a.births[i];
    const di = a.deaths[i];
    const r = reach[i];
    for (let k = countBelow(sortedBirths, bi - r); k < m && sortedBirths[k] <= bi + r; k++) {
      const j = order[k];
      const c = Math.max(Math.abs(bi - b.births[j]), Math.abs(di - b.deaths[j]));
      if (!keep(i, j, c)) continue;
      if (count === left.length) {
        if (32 * count > maxBytes) throw new DistanceBudgetError(32 * count, maxBytes);
        left = grow(left, new Int32Array(2 * count));
        right = grow(right, new Int32Array(2 * count));
        distance = grow(distance, new Float64Array(2 * count));
      }
      left[count] = i;
      right[count] = j;
      distance[count++] = c;
    }
  }
  return { count, left, right, distance };
}

/** Half the length of every point: its L∞ distance to the diagonal. */
export function diagonalDistances(d: PersistenceDiagram): Float64Array {
  const out = new Float64Array(d.births.length);
  for (let i = 0; i < out.length; i++) out[i] = (d.deaths[i] - d.births[i]) / 2;
  return out;
}

function grow<T extends Int32Array | Float64Array>(from: T, to: T): T {
  to.set(from);
  return to;
}

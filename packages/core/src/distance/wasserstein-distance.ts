import { candidatePairs, diagonalDistances } from "./candidate-pairs.js";
import { DEFAULT_DISTANCE_BYTES } from "./distance-budget-error.js";
import type { PersistenceDiagram } from "./persistence-diagram.js";
import { sparseAssignment } from "./sparse-assignment.js";

export interface WassersteinOptions {
  /** Memory the candidate pairs may take (default 1 GiB); more throws DistanceBudgetError. */
  readonly maxBytes?: number;
}

/**
 * The p-Wasserstein distance (p ≥ 1) between two persistence diagrams with the L∞ ground distance:
 *
 *   W_p(A, B) = ( min over matchings γ of Σ_{x ∈ A} ‖x − γ(x)‖_∞^p )^{1/p},
 *
 * where points may be matched to their nearest diagonal point at cost ((d − b)/2)^p (D. Cohen-Steiner,
 * H. Edelsbrunner, J. Harer, Y. Mileyko, "Lipschitz functions have L_p-stable persistence", 2010). Essential
 * classes are matched among themselves by birth (sorted order is optimal on a line); different numbers of
 * them give Infinity.
 *
 * Exact: a minimum-cost assignment with the optimum of the diagram-augmented cost matrix, solved by
 * shortest augmenting paths over a sparse matrix. A pair whose cost is at least that of sending both points
 * to the diagonal is never needed (the diagonal takes any number of points) and is left out; in barcodes of
 * real graphs that leaves a few pairs per point.
 */
export function wassersteinDistance(
  a: PersistenceDiagram,
  b: PersistenceDiagram,
  p = 1,
  options: WassersteinOptions = {},
): number {
  if (!(p >= 1 && Number.isFinite(p))) throw new RangeError(`p must be a finite number ≥ 1, got ${p}`);
  const essential = essentialCost(a.essential, b.essential, p);
  if (essential === Infinity) return Infinity;
  const total = essential + transportCost(a, b, p, options.maxBytes ?? DEFAULT_DISTANCE_BYTES);
  return p === 1 ? total : total ** (1 / p);
}

/** Σ |a_i − b_i|^p over the sorted births, or Infinity when the counts differ. */
function essentialCost(a: Float64Array, b: Float64Array, p: number): number {
  if (a.length !== b.length) return Infinity;
  let sum = 0;
  for (let i = 0; i < a.length; i++) sum += power(Math.abs(a[i] - b[i]), p);
  return sum;
}

/**
 * min Σ cost^p over matchings of the finite points, the diagonal taking any number of them. Written as a
 * rectangular assignment: every point of A takes a point j of B (saving B's diagonal cost β_j, so the entry
 * is c^p − β_j) or its own diagonal slot (α_i); the total adds Σ β_j. This has the same optimum as the
 * square (n + m) augmented matrix, whose diagonal-to-diagonal block is all zeros.
 */
function transportCost(a: PersistenceDiagram, b: PersistenceDiagram, p: number, maxBytes: number): number {
  const n = a.births.length;
  const m = b.births.length;
  const alpha = diagonalDistances(a).map((x) => power(x, p));
  const beta = diagonalDistances(b).map((x) => power(x, p));
  let total = 0;
  let betaMax = 0;
  for (let j = 0; j < m; j++) {
    total += beta[j];
    if (beta[j] > betaMax) betaMax = beta[j];
  }
  if (n === 0) return total;
  const reach = alpha.map((x) => power(x + betaMax, 1 / p));
  // Pairs are found row by row, so they come grouped by A's point, as compressed rows need them.
  const pairs = candidatePairs(a, b, reach, (i, j, c) => power(c, p) < alpha[i] + beta[j], maxBytes);
  const offsets = new Int32Array(n + 1);
  const targets = new Int32Array(pairs.count + n);
  const costs = new Float64Array(pairs.count + n);
  let e = 0;
  for (let i = 0, k = 0; i < n; i++) {
    for (; k < pairs.count && pairs.left[k] === i; k++, e++) {
      const j = pairs.right[k];
      targets[e] = j;
      costs[e] = power(pairs.distance[k], p) - beta[j];
    }
    targets[e] = m + i;
    costs[e++] = alpha[i];
    offsets[i + 1] = e;
  }
  return total + sparseAssignment(n, m + n, offsets, targets, costs).total;
}

function power(x: number, p: number): number {
  return p === 1 ? x : p === 2 ? x * x : x ** p;
}

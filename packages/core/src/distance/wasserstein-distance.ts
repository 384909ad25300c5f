import { candidatePairs, diagonalDistances } from "./candidate-pairs.js";
import { DEFAULT_DISTANCE_BYTES, DistanceBudgetError } from "./distance-budget-error.js";
import { AssignmentScratch, minCostAssignment } from "./min-cost-assignment.js";
import type { PersistenceDiagram } from "./persistence-diagram.js";

export interface WassersteinOptions {
  /** Memory one assignment matrix may take (default 1 GiB); more throws DistanceBudgetError. */
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
 * Exact: a minimum-cost assignment on the diagram-augmented cost matrix. Two reductions keep it small
 * without changing the optimum: a pair whose cost is at least that of sending both points to the diagonal
 * is never needed (the diagonal takes any number of points), and the remaining pairs split the points into
 * independent groups, each solved on its own augmented matrix.
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

/** min Σ cost^p over matchings of the finite points, the diagonal taking any number of them. */
function transportCost(a: PersistenceDiagram, b: PersistenceDiagram, p: number, maxBytes: number): number {
  const n = a.births.length;
  const m = b.births.length;
  const alpha = diagonalDistances(a).map((x) => power(x, p));
  const beta = diagonalDistances(b).map((x) => power(x, p));
  let betaMax = 0;
  for (let j = 0; j < m; j++) if (beta[j] > betaMax) betaMax = beta[j];
  const reach = alpha.map((x) => power(x + betaMax, 1 / p));
  const pairs = candidatePairs(a, b, reach, (i, j, c) => power(c, p) < alpha[i] + beta[j]);

  // Groups: points joined by a useful pair (union–find over A's points 0..n-1 and B's n..n+m-1).
  const parent = new Int32Array(n + m);
  for (let x = 0; x < n + m; x++) parent[x] = x;
  const find = (x: number): number => {
    while (parent[x] !== x) {
      parent[x] = parent[parent[x]];
      x = parent[x];
    }
    return x;
  };
  for (let e = 0; e < pairs.count; e++) {
    const r1 = find(pairs.left[e]);
    const r2 = find(n + pairs.right[e]);
    if (r1 !== r2) parent[r1] = r2;
  }

  // Points of each group, A's first, by counting sort on the root; local index of each point in its group.
  const group = new Int32Array(n + m);
  const sizeA = new Int32Array(n + m);
  const sizeB = new Int32Array(n + m);
  const local = new Int32Array(n + m);
  for (let x = 0; x < n + m; x++) {
    const r = find(x);
    group[x] = r;
    local[x] = x < n ? sizeA[r]++ : sizeB[r]++;
  }
  const edgeStart = new Int32Array(n + m + 1);
  for (let e = 0; e < pairs.count; e++) edgeStart[group[pairs.left[e]] + 1]++;
  for (let r = 0; r < n + m; r++) edgeStart[r + 1] += edgeStart[r];
  const edgeFill = edgeStart.slice(0, n + m);
  const edgesByGroup = new Int32Array(pairs.count);
  for (let e = 0; e < pairs.count; e++) edgesByGroup[edgeFill[group[pairs.left[e]]]++] = e;
  const membersStart = new Int32Array(n + m + 1);
  for (let x = 0; x < n + m; x++) membersStart[group[x] + 1]++;
  for (let r = 0; r < n + m; r++) membersStart[r + 1] += membersStart[r];
  const memberFill = membersStart.slice(0, n + m);
  const members = new Int32Array(n + m);
  for (let x = 0; x < n + m; x++) members[memberFill[group[x]]++] = x;

  const scratch = new AssignmentScratch();
  let total = 0;
  for (let r = 0; r < n + m; r++) {
    const nA = sizeA[r];
    const nB = sizeB[r];
    if (nA + nB === 0) continue;
    if (nA === 0 || nB === 0) {
      // A group without a useful pair: its points go to the diagonal.
      for (let k = membersStart[r]; k < membersStart[r + 1]; k++) {
        const x = members[k];
        total += x < n ? alpha[x] : beta[x - n];
      }
      continue;
    }
    // Augmented matrix: rows A's points then B's diagonal copies; columns B's points then A's diagonal copies.
    const N = nA + nB;
    if (N * N * 8 > maxBytes) throw new DistanceBudgetError(N * N * 8, maxBytes);
    const cost = new Float64Array(N * N).fill(Infinity);
    for (let k = membersStart[r]; k < membersStart[r + 1]; k++) {
      const x = members[k];
      const l = local[x];
      if (x < n) cost[l * N + nB + l] = alpha[x];
      else {
        const row = (nA + l) * N;
        cost[row + l] = beta[x - n];
        cost.fill(0, row + nB, row + N);
      }
    }
    for (let k = edgeStart[r]; k < edgeStart[r + 1]; k++) {
      const e = edgesByGroup[k];
      cost[local[pairs.left[e]] * N + local[n + pairs.right[e]]] = power(pairs.distance[e], p);
    }
    const columnOf = minCostAssignment(cost, N, scratch);
    for (let row = 0; row < N; row++) total += cost[row * N + columnOf[row]];
  }
  return total;
}

function power(x: number, p: number): number {
  return p === 1 ? x : p === 2 ? x * x : x ** p;
}

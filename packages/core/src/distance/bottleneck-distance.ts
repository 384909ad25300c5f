import { BipartiteMatcher } from "./bipartite-matching.js";
import { type CandidatePairs, candidatePairs, diagonalDistances } from "./candidate-pairs.js";
import type { PersistenceDiagram } from "./persistence-diagram.js";

/**
 * The bottleneck distance between two persistence diagrams with the L∞ ground distance:
 *
 *   d_B(A, B) = min over matchings γ of max_{x} ‖x − γ(x)‖_∞,
 *
 * where a point may be matched to the diagonal at cost (d − b)/2 (D. Cohen-Steiner, H. Edelsbrunner,
 * J. Harer, "Stability of persistence diagrams", Discrete Comput. Geom. 37, 2007). Essential classes are
 * matched among themselves by birth; different numbers of them give Infinity.
 *
 * Exact: the answer is one of the candidate costs (a pair's distance, or a point's distance to the
 * diagonal), found by binary search over the sorted candidates. A threshold r is feasible when every
 * point farther than r from the diagonal can be matched within r: a left-covering matching among A's far
 * points and one among B's far points (Hopcroft–Karp) suffice together, since in a bipartite graph a
 * matching covering a set of left vertices and one covering a set of right vertices give one covering both
 * (N. S. Mendelsohn, A. L. Dulmage, Canad. J. Math. 10, 1958; recalled from memory). Pairs farther apart
 * than both points are from the diagonal are never needed and are left out.
 */
export function bottleneckDistance(a: PersistenceDiagram, b: PersistenceDiagram): number {
  if (a.essential.length !== b.essential.length) return Infinity;
  let essential = 0;
  for (let i = 0; i < a.essential.length; i++)
    essential = Math.max(essential, Math.abs(a.essential[i] - b.essential[i]));
  return Math.max(essential, finiteBottleneck(a, b));
}

function finiteBottleneck(a: PersistenceDiagram, b: PersistenceDiagram): number {
  const n = a.births.length;
  const m = b.births.length;
  if (n + m === 0) return 0;
  const toDiagonalA = diagonalDistances(a);
  const toDiagonalB = diagonalDistances(b);
  let farthestB = 0;
  for (let j = 0; j < m; j++) farthestB = Math.max(farthestB, toDiagonalB[j]);
  const reach = toDiagonalA.map((x) => Math.max(x, farthestB));
  const pairs = candidatePairs(a, b, reach, (i, j, c) => c < Math.max(toDiagonalA[i], toDiagonalB[j]));

  const candidates = new Float64Array(n + m + pairs.count);
  candidates.set(toDiagonalA);
  candidates.set(toDiagonalB, n);
  candidates.set(pairs.distance.subarray(0, pairs.count), n + m);
  candidates.sort();
  const values = candidates.filter((x, i) => i === 0 || x !== candidates[i - 1]);

  const fromA = rowsOf(pairs, n, pairs.left, pairs.right);
  const fromB = rowsOf(pairs, m, pairs.right, pairs.left);
  const matchA = new BipartiteMatcher(n, m, fromA.offsets, fromA.targets, fromA.costs);
  const matchB = new BipartiteMatcher(m, n, fromB.offsets, fromB.targets, fromB.costs);
  const farA = new Uint8Array(n);
  const farB = new Uint8Array(m);
  const feasible = (r: number): boolean => {
    let needA = 0;
    let needB = 0;
    for (let i = 0; i < n; i++) needA += farA[i] = toDiagonalA[i] > r ? 1 : 0;
    for (let j = 0; j < m; j++) needB += farB[j] = toDiagonalB[j] > r ? 1 : 0;
    if (needA > 0 && matchA.maximumMatching(r, farA) < needA) return false;
    return needB === 0 || matchB.maximumMatching(r, farB) === needB;
  };
  // The largest candidate is at least every distance to the diagonal, hence feasible.
  let lo = 0;
  let hi = values.length - 1;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (feasible(values[mid])) hi = mid;
    else lo = mid + 1;
  }
  return values[lo];
}

/** The pairs as compressed rows from one side (counting sort by row). */
function rowsOf(
  pairs: CandidatePairs,
  rows: number,
  from: Int32Array,
  to: Int32Array,
): { offsets: Int32Array; targets: Int32Array; costs: Float64Array } {
  const offsets = new Int32Array(rows + 1);
  for (let e = 0; e < pairs.count; e++) offsets[from[e] + 1]++;
  for (let r = 0; r < rows; r++) offsets[r + 1] += offsets[r];
  const fill = offsets.slice(0, rows);
  const targets = new Int32Array(pairs.count);
  const costs = new Float64Array(pairs.count);
  for (let e = 0; e < pairs.count; e++) {
    const at = fill[from[e]]++;
    targets[at] = to[e];
    costs[at] = pairs.distance[e];
  }
  return { offsets, targets, costs };
}

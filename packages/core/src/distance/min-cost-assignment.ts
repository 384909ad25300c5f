/**
 * Minimum-cost perfect assignment of an N×N cost matrix (row-major, +Infinity = forbidden): the shortest
 * augmenting path method with row and column potentials (the Hungarian method of H. W. Kuhn, 1955, in the
 * O(N³) form of J. Edmonds, R. M. Karp, 1972 and R. Jonker, A. Volgenant, 1987). Returns the column of each
 * row. Throws when no finite assignment exists.
 *
 * `scratch` may be passed to reuse memory across calls (it grows as needed).
 */
export function minCostAssignment(
  cost: Float64Array,
  N: number,
  scratch = new AssignmentScratch(),
): Int32Array {
  if (cost.length !== N * N) throw new RangeError(`cost matrix has ${cost.length} entries, not ${N}×${N}`);
  scratch.reserve(N);
  const { u, v, minv } = scratch;
  const p = scratch.p; // p[j]: row (1-based) assigned to column j (1-based); p[0] the row being added
  const way = scratch.way;
  const used = scratch.used;
  u.fill(0, 0, N + 1);
  v.fill(0, 0, N + 1);
  p.fill(0, 0, N + 1);
  for (let i = 1; i <= N; i++) {
    p[0] = i;
    let j0 = 0;
    minv.fill(Infinity, 0, N + 1);
    used.fill(0, 0, N + 1);
    do {
      used[j0] = 1;
      const i0 = p[j0];
      const row = (i0 - 1) * N - 1;
      const ui0 = u[i0];
      let delta = Infinity;
      let j1 = -1;
      for (let j = 1; j <= N; j++) {
        if (used[j]) continue;
        const reduced = cost[row + j] - ui0 - v[j];
        if (reduced < minv[j]) {
          minv[j] = reduced;
          way[j] = j0;
        }
        if (minv[j] < delta) {
          delta = minv[j];
          j1 = j;
        }
      }
      if (j1 < 0 || delta === Infinity) throw new RangeError("the cost matrix admits no finite assignment");
      for (let j = 0; j <= N; j++) {
        if (used[j]) {
          u[p[j]] += delta;
          v[j] -= delta;
        } else minv[j] -= delta;
      }
      j0 = j1;
    } while (p[j0] !== 0);
    do {
      const j1 = way[j0];
      p[j0] = p[j1];
      j0 = j1;
    } while (j0 !== 0);
  }
  const columnOf = new Int32Array(N);
  for (let j = 1; j <= N; j++) columnOf[p[j] - 1] = j - 1;
  return columnOf;
}

/** Work arrays of minCostAssignment, kept between calls of one distance computation. */
export class AssignmentScratch {
  u = new Float64Array(1);
  v = new Float64Array(1);
  minv = new Float64Array(1);
  p = new Int32Array(1);
  way = new Int32Array(1);
  used = new Uint8Array(1);

  reserve(N: number): void {
    if (this.u.length > N) return;
    const size = 2 * N + 1;
    this.u = new Float64Array(size);
    this.v = new Float64Array(size);
    this.minv = new Float64Array(size);
    this.p = new Int32Array(size);
    this.way = new Int32Array(size);
    this.used = new Uint8Array(size);
  }
}

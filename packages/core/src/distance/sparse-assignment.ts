/**
 * Minimum-cost assignment of every row to its own column in a sparse cost matrix (rows ≤ columns; the
 * allowed entries as compressed rows; costs may be negative): successive shortest augmenting paths with
 * row and column potentials, each path found by Dijkstra's method over reduced costs — the Hungarian
 * method (H. W. Kuhn, 1955) in its shortest-path form (J. Edmonds, R. M. Karp, 1972; R. Jonker,
 * A. Volgenant, 1987). Rows are added one at a time; column potentials only decrease from 0, so free
 * columns keep potential 0 and the final assignment with its potentials satisfies the optimality
 * conditions of the rectangular assignment problem.
 *
 * Returns the column of each row and the total cost. Throws when some row cannot be assigned.
 */
export function sparseAssignment(
  rows: number,
  columns: number,
  offsets: Int32Array,
  targets: Int32Array,
  costs: Float64Array,
): { columnOf: Int32Array; total: number } {
  const u = new Float64Array(rows);
  const v = new Float64Array(columns);
  const rowOf = new Int32Array(columns).fill(-1);
  const columnOf = new Int32Array(rows).fill(-1);
  const dist = new Float64Array(columns).fill(Infinity);
  const via = new Int32Array(columns); // the row a column was reached from
  const done = new Uint8Array(columns);
  const finalised = new Int32Array(columns);
  const touched = new Int32Array(columns);
  // Indexed binary heap of columns by dist (each column at most once: keys only decrease).
  const heap = new Int32Array(columns);
  const place = new Int32Array(columns).fill(-1);

  for (let r = 0; r < rows; r++) {
    let start = Infinity;
    let nearest = -1;
    for (let e = offsets[r]; e < offsets[r + 1]; e++) {
      const c = costs[e] - v[targets[e]];
      if (c < start || (c === start && rowOf[targets[e]] < 0)) {
        start = c;
        nearest = targets[e];
      }
    }
    if (nearest < 0) throw new RangeError(`row ${r} has no allowed column`);
    u[r] = start; // reduced costs of the new row's entries are ≥ 0
    if (rowOf[nearest] < 0) {
      // Its cheapest column is free: a shortest path of one step, no potential moves.
      rowOf[nearest] = r;
      columnOf[r] = nearest;
      continue;
    }
    let touchedCount = 0;
    let finalCount = 0;
    let heapSize = 0;
    let sink = -1;
    let reach = 0;
    let i = r;
    let base = 0;
    for (;;) {
      // Relax the entries of row i, reached at distance `base`.
      const ui = u[i];
      for (let e = offsets[i]; e < offsets[i + 1]; e++) {
        const j = targets[e];
        if (done[j]) continue;
        const d = base + costs[e] - ui - v[j];
        if (d >= dist[j]) continue;
        let at: number;
        if (dist[j] === Infinity) {
          touched[touchedCount++] = j;
          at = heapSize++;
        } else at = place[j];
        dist[j] = d;
        via[j] = i;
        while (at > 0) {
          const parent = (at - 1) >> 1;
          const above = heap[parent];
          if (dist[above] <= d) break;
          heap[at] = above;
          place[above] = at;
          at = parent;
        }
        heap[at] = j;
        place[j] = at;
      }
      if (heapSize === 0) break;
      // Take the nearest column.
      const j = heap[0];
      const last = heap[--heapSize];
      if (heapSize > 0) {
        const key = dist[last];
        let at = 0;
        for (;;) {
          let child = 2 * at + 1;
          if (child >= heapSize) break;
          if (child + 1 < heapSize && dist[heap[child + 1]] < dist[heap[child]]) child++;
          if (dist[heap[child]] >= key) break;
          heap[at] = heap[child];
          place[heap[at]] = at;
          at = child;
        }
        heap[at] = last;
        place[last] = at;
      }
      done[j] = 1;
      if (rowOf[j] < 0) {
        sink = j;
        reach = dist[j];
        break;
      }
      finalised[finalCount++] = j;
      i = rowOf[j]; // the matched entry (rowOf[j], j) has reduced cost 0
      base = dist[j];
    }
    if (sink < 0) throw new RangeError(`row ${r} cannot be assigned without leaving another row out`);
    // Potentials: reduced costs stay ≥ 0 everywhere and 0 on the assignment after the flip below.
    u[r] += reach;
    for (let k = 0; k < finalCount; k++) {
      const j = finalised[k];
      const shift = reach - dist[j];
      v[j] -= shift;
      u[rowOf[j]] += shift;
    }
    for (let j = sink; ; ) {
      const from = via[j];
      const previous = columnOf[from];
      rowOf[j] = from;
      columnOf[from] = j;
      if (from === r) break;
      j = previous;
    }
    for (let k = 0; k < touchedCount; k++) {
      dist[touched[k]] = Infinity;
      done[touched[k]] = 0;
      place[touched[k]] = -1;
    }
  }
  let total = 0;
  for (let i = 0; i < rows; i++) {
    for (let e = offsets[i]; e < offsets[i + 1]; e++) {
      if (targets[e] === columnOf[i]) {
        total += costs[e];
        break;
      }
    }
  }
  return { columnOf, total };
}

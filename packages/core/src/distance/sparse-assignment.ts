/**
 * Minimum-cost assignment of every row to its own column in a sparse cost matrix (rows ≤ columns; the
 * allowed entries as compressed rows; costs may be negative), in two phases after R. Jonker, A. Volgenant,
 * "A shortest augmenting path algorithm for dense and sparse linear assignment problems", Computing 38,
 * 1987:
 *
 * 1. augmenting row reduction: a free row takes the column of its smallest reduced cost c_ij − v_j and
 *    lowers that column's potential by the gap to its second smallest, displacing the column's row, which
 *    tries again at once; cheap auction-like steps that assign most rows of a clustered diagram;
 * 2. successive shortest augmenting paths for the rows still free, each path found by Dijkstra's method over
 *    reduced costs with row and column potentials — the Hungarian method (H. W. Kuhn, 1955) in its
 *    shortest-path form (J. Edmonds, R. M. Karp, 1972).
 *
 * Invariants of both phases: every assigned row's column has the smallest reduced cost of its row, and
 * column potentials start at 0 and only decrease, and only on columns that are (and then stay) assigned, so
 * free columns keep potential 0 and the final assignment with its potentials satisfies the optimality
 * conditions of the rectangular assignment problem. (Jonker and Volgenant's column reduction, which sets
 * potentials of columns that may stay free, is for square problems and is not used.) Since v ≤ 0, an
 * entry's cost bounds its reduced cost from below: with each row's entries ordered by cost, every scan
 * stops at the first entry that cannot beat what it has already found.
 *
 * Returns the column of each row and the total cost. Throws when some row cannot be assigned.
 */
export function sparseAssignment(
  rows: number,
  columns: number,
  offsets: Int32Array,
  entryTargets: Int32Array,
  entryCosts: Float64Array,
): { columnOf: Int32Array; total: number } {
  const { targets, costs, floor } = sortedRows(rows, offsets, entryTargets, entryCosts);
  const u = new Float64Array(rows);
  const v = new Float64Array(columns);
  const rowOf = new Int32Array(columns).fill(-1);
  const columnOf = new Int32Array(rows).fill(-1);
  const free = augmentingRowReduction(rows, offsets, targets, costs, floor, u, v, rowOf, columnOf);
  const dist = new Float64Array(columns).fill(Infinity);
  const via = new Int32Array(columns); // the row a column was reached from
  const done = new Uint8Array(columns);
  const finalised = new Int32Array(columns);
  const touched = new Int32Array(columns);
  // Indexed binary heap of columns by dist (each column at most once: keys only decrease).
  const heap = new Int32Array(columns);
  const place = new Int32Array(columns).fill(-1);

  for (const r of free) {
    let start = Infinity;
    let nearest = -1;
    for (let e = offsets[r]; e < offsets[r + 1]; e++) {
      if (floor[e] > start) break; // v ≤ 0: no later entry can be cheaper
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
    // The nearest free column seen so far: an entry that cannot beat it is of no use to this path.
    let bestFree = Infinity;
    for (;;) {
      // Relax the entries of row i, reached at distance `base`, cheapest first.
      const ui = u[i];
      const useless = bestFree - base + ui;
      for (let e = offsets[i]; e < offsets[i + 1]; e++) {
        if (floor[e] >= useless) break; // d ≥ base + cost − u_i ≥ bestFree, as v ≤ 0
        const j = targets[e];
        if (done[j]) continue;
        const d = base + costs[e] - ui - v[j];
        if (d >= dist[j]) continue;
        if (rowOf[j] < 0 && d < bestFree) bestFree = d;
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

/** A row's entries nearly in increasing cost, with the exact least cost from each entry to the row's end. */
interface SortedRows {
  readonly targets: Int32Array;
  readonly costs: Float64Array;
  /** floor[e]: the least cost among entries e … row end; since potentials v ≤ 0, a bound on their reduced costs. */
  readonly floor: Float64Array;
}

/**
 * Orders every row's entries by cost, so that scans can stop at the first entry whose floor rules out the
 * rest of the row: a counting sort into as many buckets as the row has entries, by position between its
 * least and greatest cost (monotone in the cost), in linear time. Within a bucket the order is the input's;
 * the floors keep the bounds exact.
 */
function sortedRows(rows: number, offsets: Int32Array, targets: Int32Array, costs: Float64Array): SortedRows {
  const total = costs.length;
  const sortedTargets = new Int32Array(total);
  const sortedCosts = new Float64Array(total);
  const floor = new Float64Array(total);
  const bucketOf = new Int32Array(total);
  let longest = 0;
  for (let i = 0; i < rows; i++) longest = Math.max(longest, offsets[i + 1] - offsets[i]);
  const next = new Int32Array(longest + 1);
  for (let i = 0; i < rows; i++) {
    const from = offsets[i];
    const to = offsets[i + 1];
    const length = to - from;
    if (length === 0) continue;
    let low = Infinity;
    let high = -Infinity;
    for (let e = from; e < to; e++) {
      if (costs[e] < low) low = costs[e];
      if (costs[e] > high) high = costs[e];
    }
    const scale = high > low ? (length - 1) / (high - low) : 0;
    next.fill(0, 0, length + 1);
    for (let e = from; e < to; e++) {
      const bucket = Math.min(length - 1, Math.floor((costs[e] - low) * scale));
      bucketOf[e] = bucket;
      next[bucket + 1]++;
    }
    for (let b = 1; b < length; b++) next[b] += next[b - 1];
    for (let e = from; e < to; e++) {
      const at = from + next[bucketOf[e]]++;
      sortedTargets[at] = targets[e];
      sortedCosts[at] = costs[e];
    }
    let least = Infinity;
    for (let e = to - 1; e >= from; e--) {
      if (sortedCosts[e] < least) least = sortedCosts[e];
      floor[e] = least;
    }
  }
  return { targets: sortedTargets, costs: sortedCosts, floor };
}

/** Steps of the row reduction per row before the rest is left to shortest paths (a price war can be long). */
const REDUCTION_STEPS_PER_ROW = 8;

/**
 * Phase 1 (Jonker and Volgenant's augmenting row reduction, two passes over the free rows): fills u, v,
 * rowOf and columnOf and returns the rows left free, in increasing order.
 */
function augmentingRowReduction(
  rows: number,
  offsets: Int32Array,
  targets: Int32Array,
  costs: Float64Array,
  floor: Float64Array,
  u: Float64Array,
  v: Float64Array,
  rowOf: Int32Array,
  columnOf: Int32Array,
): Int32Array {
  const free = new Int32Array(rows);
  for (let i = 0; i < rows; i++) free[i] = i;
  let freeCount = rows;
  let budget = REDUCTION_STEPS_PER_ROW * rows;
  for (let pass = 0; pass < 2 && freeCount > 0; pass++) {
    const listed = freeCount;
    freeCount = 0;
    let k = 0;
    while (k < listed) {
      const i = free[k++];
      if (budget-- <= 0) {
        free[freeCount++] = i;
        continue;
      }
      // The smallest and second smallest reduced cost of row i, ties to a free column.
      let u1 = Infinity;
      let u2 = Infinity;
      let j1 = -1;
      let j2 = -1;
      let e1 = -1;
      let e2 = -1;
      for (let e = offsets[i]; e < offsets[i + 1]; e++) {
        if (floor[e] > u2) break; // v ≤ 0: no later entry can be among the two cheapest
        const j = targets[e];
        const h = costs[e] - v[j];
        if (h < u1 || (h === u1 && rowOf[j] < 0 && j1 >= 0 && rowOf[j1] >= 0)) {
          u2 = u1;
          j2 = j1;
          e2 = e1;
          u1 = h;
          j1 = j;
          e1 = e;
        } else if (h < u2) {
          u2 = h;
          j2 = j;
          e2 = e;
        }
      }
      if (j1 < 0) throw new RangeError(`row ${i} has no allowed column`);
      let displaced = rowOf[j1];
      if (u1 < u2 && u2 < Infinity) {
        // Take j1 at the price of the next best: row i's reduced cost there becomes u2, still its smallest.
        v[j1] -= u2 - u1;
      } else if (displaced >= 0) {
        if (u2 === Infinity) {
          free[freeCount++] = i; // its only column is taken: shortest paths will place it
          continue;
        }
        // A tie between two columns, the first taken: take the second (its row, if any, waits its turn).
        j1 = j2;
        e1 = e2;
        displaced = rowOf[j2];
      }
      u[i] = costs[e1] - v[j1]; // exactly: the assigned entry's reduced cost is 0
      rowOf[j1] = i;
      columnOf[i] = j1;
      if (displaced >= 0) {
        columnOf[displaced] = -1;
        if (u1 < u2)
          free[--k] = displaced; // its column got dearer: it bids again at once
        else free[freeCount++] = displaced;
      }
    }
  }
  return free.subarray(0, freeCount).sort();
}

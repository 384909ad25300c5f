/**
 * Renumbers a directed graph's vertices in breadth-first order along out-edges (each unvisited vertex in
 * turn starts a new search) and writes its lists in the new numbering to `outOffsets` / `outTargets`
 * (length n + 1 and offsets[n]). Counts do not depend on labels; the order only brings the out-lists that
 * one root scans (and the next roots scan) close together in memory, which matters on large sparse graphs
 * whose vertex numbers carry no locality (e.g. spatial networks numbered at random).
 */
export function writeBreadthFirstOrder(
  n: number,
  offsets: Int32Array,
  targets: Int32Array,
  outOffsets: Int32Array,
  outTargets: Int32Array,
): void {
  const newId = new Int32Array(n).fill(-1);
  const order = new Int32Array(n); // order[k] = old id of new vertex k; doubles as the queue
  let next = 0;
  let head = 0;
  for (let r = 0; r < n; r++) {
    if (newId[r] >= 0) continue;
    newId[r] = next;
    order[next++] = r;
    while (head < next) {
      const v = order[head++];
      for (let s = offsets[v]; s < offsets[v + 1]; s++) {
        const u = targets[s];
        if (newId[u] < 0) {
          newId[u] = next;
          order[next++] = u;
        }
      }
    }
  }
  let o = 0;
  outOffsets[0] = 0;
  for (let k = 0; k < n; k++) {
    const v = order[k];
    for (let s = offsets[v]; s < offsets[v + 1]; s++) outTargets[o++] = newId[targets[s]];
    outOffsets[k + 1] = o;
  }
}

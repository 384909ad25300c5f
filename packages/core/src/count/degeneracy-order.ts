/**
 * Degeneracy (smallest-last) order of an undirected graph by bucket peeling, in O(n + m):
 * D. W. Matula and L. L. Beck, "Smallest-last ordering and clustering and graph coloring algorithms",
 * J. ACM 30(3), 1983; bucket layout after V. Batagelj and M. Zaversnik, "An O(m) algorithm for cores
 * decomposition of networks", 2003. Every vertex has at most `degeneracy` neighbours later in the order,
 * which bounds the local universes of the clique enumeration.
 *
 * `offsets`/`targets` hold both directions of every edge. Returns `order` (position → vertex).
 */
export function degeneracyOrder(n: number, offsets: Int32Array, targets: Int32Array): Int32Array {
  const degree = new Int32Array(n);
  let maxDegree = 0;
  for (let v = 0; v < n; v++) {
    degree[v] = offsets[v + 1] - offsets[v];
    if (degree[v] > maxDegree) maxDegree = degree[v];
  }
  const binStart = new Int32Array(maxDegree + 2);
  for (let v = 0; v < n; v++) binStart[degree[v] + 1]++;
  for (let d = 0; d <= maxDegree; d++) binStart[d + 1] += binStart[d];
  const order = new Int32Array(n);
  const position = new Int32Array(n);
  const fill = binStart.slice(0, maxDegree + 1);
  for (let v = 0; v < n; v++) {
    position[v] = fill[degree[v]]++;
    order[position[v]] = v;
  }
  for (let i = 0; i < n; i++) {
    const v = order[i];
    for (let s = offsets[v]; s < offsets[v + 1]; s++) {
      const u = targets[s];
      const du = degree[u];
      if (du > degree[v]) {
        // move u to the front of its bucket, then shrink the bucket boundary past it
        const pu = position[u];
        const pw = binStart[du];
        const w = order[pw];
        if (u !== w) {
          order[pu] = w;
          position[w] = pu;
          order[pw] = u;
          position[u] = pw;
        }
        binStart[du]++;
        degree[u]--;
      }
    }
  }
  return order;
}

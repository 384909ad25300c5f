/**
 * For each edge slot, the index of the first grid value at or above its filtration value, or -1 when the
 * edge enters after the last threshold. A simplex enters the grid at the largest bin of its edges, so the
 * enumeration can work with small integers instead of floating-point comparisons.
 */
export function edgeBins(edgeF: Float64Array, gridF: Float64Array): Int32Array {
  const bins = new Int32Array(edgeF.length);
  const last = gridF.length - 1;
  for (let s = 0; s < edgeF.length; s++) {
    const f = edgeF[s];
    if (last < 0 || f > gridF[last]) {
      bins[s] = -1;
      continue;
    }
    let lo = 0;
    let hi = last;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (gridF[mid] >= f) hi = mid;
      else lo = mid + 1;
    }
    bins[s] = lo;
  }
  return bins;
}

/**
 * Ranks 1..length of `values[from .. from + length)`, written to `out[to .. to + length)`; tied values
 * share the mean of the ranks they span ("average" ranks, as scipy.stats.rankdata's default method).
 * `sorted` is scratch space of at least `length` entries. Values must not be NaN.
 *
 * A value x equal to the sorted values at positions lo..hi−1 (0-based) has the ranks lo+1 .. hi, whose mean
 * is (lo + 1 + hi) / 2; lo and hi come from binary searches in a copy sorted by the typed array's own numeric
 * sort, which is several times faster than sorting indices with a comparator.
 */
export function averageRanks(
  values: Float64Array,
  from: number,
  length: number,
  out: Float64Array,
  to: number,
  sorted: Float64Array,
): void {
  const copy = sorted.subarray(0, length);
  copy.set(values.subarray(from, from + length));
  copy.sort();
  for (let t = 0; t < length; t++) {
    const x = values[from + t];
    let lo = 0;
    let hi = length;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (copy[mid] < x) lo = mid + 1;
      else hi = mid;
    }
    let end = lo;
    hi = length;
    while (end < hi) {
      const mid = (end + hi) >>> 1;
      if (copy[mid] <= x) end = mid + 1;
      else hi = mid;
    }
    out[to + t] = (lo + 1 + end) / 2;
  }
}

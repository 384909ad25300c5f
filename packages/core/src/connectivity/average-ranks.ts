/**
 * Ranks 1..length of `values[from .. from + length)`, written to `out[to .. to + length)`; tied values
 * share the mean of the ranks they span ("average" ranks, as scipy.stats.rankdata's default method).
 * `order` is scratch space of at least `length` entries.
 */
export function averageRanks(
  values: Float64Array,
  from: number,
  length: number,
  out: Float64Array,
  to: number,
  order: Uint32Array,
): void {
  const index = order.subarray(0, length);
  for (let t = 0; t < length; t++) index[t] = t;
  index.sort((p, q) => values[from + p] - values[from + q]);
  let start = 0;
  while (start < length) {
    let end = start + 1;
    const x = values[from + index[start]];
    while (end < length && values[from + index[end]] === x) end++;
    // Positions start..end−1 hold equal values: ranks start+1 .. end, mean (start + 1 + end) / 2.
    const rank = (start + 1 + end) / 2;
    for (let k = start; k < end; k++) out[to + index[k]] = rank;
    start = end;
  }
}

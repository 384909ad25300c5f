/**
 * The q-quantile of `sorted` (ascending) by linear interpolation between the closest ranks: position
 * q·(N−1), as numpy.quantile's default method ("linear", R's type 7; R. J. Hyndman, Y. Fan, "Sample quantiles
 * in statistical packages", The American Statistician, 1996).
 */
export function quantileOfSorted(sorted: ArrayLike<number>, q: number): number {
  const N = sorted.length;
  if (N === 0) throw new RangeError("no values to take a quantile of");
  if (!(q >= 0 && q <= 1)) throw new RangeError(`quantile ${q} is not in [0, 1]`);
  const position = q * (N - 1);
  const below = Math.floor(position);
  const above = Math.min(below + 1, N - 1);
  const fraction = position - below;
  return sorted[below] + (sorted[above] - sorted[below]) * fraction;
}

/**
 * At most `limit` of a graph's edge values, evenly strided so a sample keeps the spread of the whole. Keeps
 * the first pass over a huge dataset within memory: all the samples together stay under a fixed budget.
 */
export function strideSample(values: Float64Array, limit: number): Float64Array {
  if (values.length <= limit) return values;
  const out = new Float64Array(limit);
  const step = values.length / limit;
  for (let i = 0; i < limit; i++) out[i] = values[Math.floor(i * step)];
  return out;
}

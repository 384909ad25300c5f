/**
 * Centres each of the `rows` rows of `source` (row r at source[offset + r·stride], `length` values long)
 * and scales it to unit Euclidean norm, writing them contiguously to `out` (rows × length). The dot product
 * of two such rows is the Pearson correlation of the originals. A row without variation has norm 0 and is
 * left as zeros, so its correlations come out 0, not NaN; callers check for such rows first.
 */
export function standardizeRows(
  source: Float64Array,
  rows: number,
  length: number,
  stride: number,
  offset: number,
  out: Float64Array,
): Float64Array {
  for (let r = 0; r < rows; r++) {
    const from = offset + r * stride;
    const to = r * length;
    let sum = 0;
    for (let t = 0; t < length; t++) sum += source[from + t];
    const mean = sum / length;
    let squares = 0;
    for (let t = 0; t < length; t++) {
      const x = source[from + t] - mean;
      out[to + t] = x;
      squares += x * x;
    }
    const scale = squares > 0 ? 1 / Math.sqrt(squares) : 0;
    for (let t = 0; t < length; t++) out[to + t] *= scale;
  }
  return out;
}

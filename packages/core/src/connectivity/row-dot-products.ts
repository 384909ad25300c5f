/*
 * Dot products between the rows of row-major matrices: the one kernel under every correlation measure
 * (a correlation matrix is the Gram matrix of standardised channels). Four rows of the right-hand matrix
 * share each load of the left-hand row, which is what makes this loop fast in JavaScript.
 */

/**
 * out[i·rows + j] = Σ_t a[i·length + t] · a[j·length + t] for every pair of the `rows` rows of `a`
 * (each `length` long); the matrix is symmetric and filled on both sides.
 */
export function rowGram(a: Float64Array, rows: number, length: number, out: Float64Array): Float64Array {
  for (let i = 0; i < rows; i++) {
    const from = i * length;
    let j = i;
    for (; j + 3 < rows; j += 4) {
      const b0 = j * length;
      const b1 = b0 + length;
      const b2 = b1 + length;
      const b3 = b2 + length;
      let s0 = 0;
      let s1 = 0;
      let s2 = 0;
      let s3 = 0;
      for (let t = 0; t < length; t++) {
        const x = a[from + t];
        s0 += x * a[b0 + t];
        s1 += x * a[b1 + t];
        s2 += x * a[b2 + t];
        s3 += x * a[b3 + t];
      }
      out[i * rows + j] = out[j * rows + i] = s0;
      out[i * rows + j + 1] = out[(j + 1) * rows + i] = s1;
      out[i * rows + j + 2] = out[(j + 2) * rows + i] = s2;
      out[i * rows + j + 3] = out[(j + 3) * rows + i] = s3;
    }
    for (; j < rows; j++) {
      const b = j * length;
      let s = 0;
      for (let t = 0; t < length; t++) s += a[from + t] * a[b + t];
      out[i * rows + j] = out[j * rows + i] = s;
    }
  }
  return out;
}

/**
 * out[i·rows + j] = Σ_t a[i·length + t] · b[j·length + t]: every row of `a` against every row of `b`
 * (both `rows` × `length`); not symmetric in general.
 */
export function rowCrossProducts(
  a: Float64Array,
  b: Float64Array,
  rows: number,
  length: number,
  out: Float64Array,
): Float64Array {
  for (let i = 0; i < rows; i++) {
    const from = i * length;
    let j = 0;
    for (; j + 3 < rows; j += 4) {
      const b0 = j * length;
      const b1 = b0 + length;
      const b2 = b1 + length;
      const b3 = b2 + length;
      let s0 = 0;
      let s1 = 0;
      let s2 = 0;
      let s3 = 0;
      for (let t = 0; t < length; t++) {
        const x = a[from + t];
        s0 += x * b[b0 + t];
        s1 += x * b[b1 + t];
        s2 += x * b[b2 + t];
        s3 += x * b[b3 + t];
      }
      out[i * rows + j] = s0;
      out[i * rows + j + 1] = s1;
      out[i * rows + j + 2] = s2;
      out[i * rows + j + 3] = s3;
    }
    for (; j < rows; j++) {
      const c = j * length;
      let s = 0;
      for (let t = 0; t < length; t++) s += a[from + t] * b[c + t];
      out[i * rows + j] = s;
    }
  }
  return out;
}

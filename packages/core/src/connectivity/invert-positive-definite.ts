/**
 * The inverse of a symmetric positive-definite n × n matrix (row-major), by its Cholesky factor A = LLᵀ:
 * A⁻¹ = L⁻ᵀL⁻¹ (a textbook method: G. H. Golub, C. F. Van Loan, "Matrix Computations", 4th ed., 2013,
 * section 4.2). Returns null when a pivot is not positive, i.e. the matrix is not positive definite
 * (to working precision). The input is not changed.
 */
export function invertPositiveDefinite(a: Float64Array, n: number): Float64Array | null {
  // Cholesky factor, lower triangle of L (row-major).
  const L = new Float64Array(n * n);
  for (let j = 0; j < n; j++) {
    let d = a[j * n + j];
    for (let k = 0; k < j; k++) d -= L[j * n + k] * L[j * n + k];
    if (!(d > 0)) return null;
    const pivot = Math.sqrt(d);
    L[j * n + j] = pivot;
    for (let i = j + 1; i < n; i++) {
      let s = a[i * n + j];
      for (let k = 0; k < j; k++) s -= L[i * n + k] * L[j * n + k];
      L[i * n + j] = s / pivot;
    }
  }
  // M = L⁻¹ (lower triangular), row by row: M_i = (e_i − Σ_{k<i} L_ik M_k) / L_ii, rows read contiguously.
  const M = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    const row = i * n;
    for (let k = 0; k < i; k++) {
      const l = L[row + k];
      if (l === 0) continue;
      const from = k * n;
      for (let j = 0; j <= k; j++) M[row + j] -= l * M[from + j];
    }
    M[row + i] += 1;
    const pivot = L[row + i];
    for (let j = 0; j <= i; j++) M[row + j] /= pivot;
  }
  // A⁻¹ = Mᵀ M: entry (i, j) = Σ_{k ≥ max(i, j)} M_ki M_kj.
  const inverse = new Float64Array(n * n);
  for (let k = 0; k < n; k++) {
    const row = k * n;
    for (let i = 0; i <= k; i++) {
      const m = M[row + i];
      if (m === 0) continue;
      for (let j = 0; j <= i; j++) inverse[i * n + j] += m * M[row + j];
    }
  }
  for (let i = 0; i < n; i++) for (let j = 0; j < i; j++) inverse[j * n + i] = inverse[i * n + j];
  return inverse;
}

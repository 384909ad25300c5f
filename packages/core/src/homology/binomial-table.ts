/**
 * Binomial coefficients C(v, k) for v ≤ n and k ≤ maxK, the weights of the combinatorial number system:
 * the k-subset {s_0 < … < s_{k-1}} of 0 .. n-1 has index Σ C(s_i, i+1) (D. Knuth, The Art of Computer
 * Programming vol. 4A, 2011, §7.2.1.3). Indices must stay exact in doubles, so C(n, maxK) < 2^53.
 */
export interface BinomialTable {
  readonly n: number;
  readonly maxK: number;
  /** C(v, k) at [k * (n + 1) + v]. */
  readonly values: Float64Array;
}

export function binomialTable(n: number, maxK: number): BinomialTable {
  const values = new Float64Array((maxK + 1) * (n + 1));
  const row = n + 1;
  for (let v = 0; v <= n; v++) values[v] = 1;
  for (let k = 1; k <= maxK; k++) {
    for (let v = k; v <= n; v++)
      values[k * row + v] = values[k * row + v - 1] + values[(k - 1) * row + v - 1];
  }
  const largest = values[maxK * row + n];
  if (largest >= 2 ** 53) {
    throw new RangeError(
      `simplices of ${maxK} vertices among ${n} nodes cannot be indexed exactly (C(${n}, ${maxK}) ≥ 2^53); lower maxDim`,
    );
  }
  return { n, maxK, values };
}

export function binomial(table: BinomialTable, v: number, k: number): number {
  return table.values[k * (table.n + 1) + v];
}

/** Index of the ascending vertex list `vertices[0 .. count)`. */
export function encodeSimplex(table: BinomialTable, vertices: ArrayLike<number>, count: number): number {
  let key = 0;
  for (let i = 0; i < count; i++) key += table.values[(i + 1) * (table.n + 1) + vertices[i]];
  return key;
}

/** Writes the ascending vertices of the `count`-vertex simplex (count ≥ 1) with index `key` into `out`. */
export function decodeSimplex(table: BinomialTable, key: number, count: number, out: Int32Array): void {
  const row = table.n + 1;
  let hi = table.n - 1;
  for (let k = count; k >= 3; k--) {
    // Largest v ≤ hi with C(v, k) ≤ key (greedy digit of the combinatorial number system).
    let lo = k - 1;
    let top = hi;
    const base = k * row;
    while (lo < top) {
      const mid = (lo + top + 1) >>> 1;
      if (table.values[base + mid] <= key) lo = mid;
      else top = mid - 1;
    }
    out[k - 1] = lo;
    key -= table.values[base + lo];
    hi = lo - 1;
  }
  // The last two digits in closed form (decoding runs once per coboundary pushed): the largest v with
  // v(v − 1)/2 ≤ key is ⌊(1 + √(1 + 8·key)) / 2⌋. 1 + 8·key is an exact double and √ is correctly
  // rounded, so the root of a perfect square is exact; just below one, at C(v, 2) − 1, the root is about
  // 4/(2v − 1) under 2v − 1, which rounding can lose only past v ≈ 1.3·10^8 — hence the check. Then
  // C(v, 1) = v ≤ key leaves v = key.
  if (count >= 2) {
    let v = Math.floor((1 + Math.sqrt(1 + 8 * key)) / 2);
    if ((v * (v - 1)) / 2 > key) v--;
    out[1] = v;
    key -= (v * (v - 1)) / 2;
  }
  out[0] = key;
}

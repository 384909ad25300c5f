/**
 * Fisher's z-transform of the off-diagonal correlations of an n × n matrix, z = atanh(r) = ½ ln((1 + r) /
 * (1 − r)), which makes sample correlations roughly normal with variance 1/(T − 3) (R. A. Fisher, "Frequency
 * distribution of the values of the correlation coefficient in samples from an indefinitely large
 * population", Biometrika 10, 1915). The diagonal is left as it is. |r| = 1 gives ±infinity: check first
 * with perfectCorrelation.
 */
export function fisherZ(r: Float64Array, n: number): Float64Array {
  const z = new Float64Array(r.length);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) z[i * n + j] = i === j ? r[i * n + j] : Math.atanh(r[i * n + j]);
  }
  return z;
}

/** The first off-diagonal pair (i, j) with |r| = 1, or null. */
export function perfectCorrelation(r: Float64Array, n: number): [number, number] | null {
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) if (i !== j && Math.abs(r[i * n + j]) >= 1) return [i, j];
  }
  return null;
}

/** Euler characteristic Σ_k (−1)^k c_k of per-dimension simplex counts. */
export function eulerCharacteristic(counts: ArrayLike<number>): number {
  let chi = 0;
  for (let k = 0; k < counts.length; k++) chi += k % 2 === 0 ? counts[k] : -counts[k];
  return chi;
}

/** Exact small-number combinatorics for expected counts (all results are integers below 2^53). */

export function binomial(n: number, k: number): number {
  if (k < 0 || k > n) return 0;
  let result = 1;
  for (let i = 1; i <= Math.min(k, n - k); i++) result = (result * (n - Math.min(k, n - k) + i)) / i;
  return Math.round(result);
}

export function factorial(n: number): number {
  let result = 1;
  for (let i = 2; i <= n; i++) result *= i;
  return result;
}

/** n (n−1) … (n−m+1): the number of ordered m-tuples of distinct items out of n. */
export function fallingFactorial(n: number, m: number): number {
  if (m > n) return 0;
  let result = 1;
  for (let i = 0; i < m; i++) result *= n - i;
  return result;
}

/** How an observed value compares with the values of null-model samples. */
export interface NullComparison {
  readonly observed: number;
  readonly samples: number;
  readonly mean: number;
  /** Sample standard deviation (divided by samples − 1); 0 for fewer than two samples. */
  readonly sd: number;
  /** (observed − mean) / sd; null when sd = 0 (every sample equal: no spread to measure against). */
  readonly z: number | null;
  /** (1 + #{null ≥ observed}) / (samples + 1): how often chance reaches the observed value or more. */
  readonly pGreater: number;
  /** (1 + #{null ≤ observed}) / (samples + 1). */
  readonly pLess: number;
  /** min(1, 2 · min(pGreater, pLess)): either direction. */
  readonly pTwoSided: number;
}

/**
 * Mean, standard deviation, z-score and empirical p-values of an observed value against null samples.
 * The p-values count the observed value as one more sample, so they are never 0 and are exact tail
 * probabilities under the null (B. Phipson, G. K. Smyth, "Permutation p-values should never be zero",
 * Stat. Appl. Genet. Mol. Biol. 9, 2010; recalled from memory): with N samples the smallest is 1/(N + 1).
 */
export function compareWithNull(observed: number, nulls: ArrayLike<number>): NullComparison {
  const N = nulls.length;
  let mean = 0;
  for (let i = 0; i < N; i++) mean += nulls[i];
  mean = N > 0 ? mean / N : Number.NaN;
  let squares = 0;
  let greater = 0;
  let less = 0;
  for (let i = 0; i < N; i++) {
    squares += (nulls[i] - mean) ** 2;
    if (nulls[i] >= observed) greater++;
    if (nulls[i] <= observed) less++;
  }
  const sd = N > 1 ? Math.sqrt(squares / (N - 1)) : 0;
  const pGreater = (1 + greater) / (N + 1);
  const pLess = (1 + less) / (N + 1);
  return {
    observed,
    samples: N,
    mean,
    sd,
    z: sd > 0 ? (observed - mean) / sd : null,
    pGreater,
    pLess,
    pTwoSided: Math.min(1, 2 * Math.min(pGreater, pLess)),
  };
}

/**
 * Arithmetic in Z/p. Coefficients live in 0 .. p-1; inverses come from a table so the reduction loop
 * never runs Euclid's algorithm.
 */
export interface PrimeField {
  readonly p: number;
  /** inverse[a] · a ≡ 1 (mod p) for a in 1 .. p-1. */
  readonly inverse: Int32Array;
}

/** Largest prime accepted: products of two coefficients stay exact in doubles and the table stays small. */
export const MAX_PRIME = 65521;

export function isPrime(p: number): boolean {
  if (!Number.isInteger(p) || p < 2) return false;
  for (let d = 2; d * d <= p; d++) if (p % d === 0) return false;
  return true;
}

export function primeField(p: number): PrimeField {
  if (!isPrime(p) || p > MAX_PRIME) {
    throw new RangeError(`coefficients need a prime p with 2 ≤ p ≤ ${MAX_PRIME}, got ${p}`);
  }
  const inverse = new Int32Array(p);
  if (p > 1) inverse[1] = 1;
  // inv(a) = -(p / a) · inv(p mod a) mod p: one pass, common practice for modular inverse tables.
  for (let a = 2; a < p; a++) inverse[a] = (p - ((Math.floor(p / a) * inverse[p % a]) % p)) % p;
  return { p, inverse };
}

/** a mod p in 0 .. p-1 for any integer a (also negative). */
export function modP(a: number, p: number): number {
  const r = a % p;
  return r < 0 ? r + p : r + 0; // + 0 turns -0 into 0
}

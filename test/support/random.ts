/**
 * A small seeded pseudo-random generator for reproducible test graphs.
 *
 * xoshiro128** (D. Blackman and S. Vigna, "Scrambled linear pseudorandom number generators", ACM TOMS
 * 47(4), 2021). Its 128-bit state is filled from the seed by a SplitMix-style mixer (golden-ratio
 * increment, then MurmurHash3's 32-bit finaliser), so nearby seeds give unrelated streams. Tests need
 * repeatable, well-mixed bits, not cryptographic strength.
 */
export type Random = () => number;

/** A generator of floats in [0, 1) fully determined by `seed`. */
export function seededRandom(seed: number): Random {
  let mix = seed >>> 0;
  const mixSeed = (): number => {
    mix = (mix + 0x9e3779b9) >>> 0;
    let z = mix;
    z = Math.imul(z ^ (z >>> 16), 0x85ebca6b);
    z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35);
    return (z ^ (z >>> 16)) >>> 0;
  };
  let a = mixSeed();
  let b = mixSeed();
  let c = mixSeed();
  let d = mixSeed();
  return () => {
    const result = Math.imul(rotl(Math.imul(b, 5), 7), 9) >>> 0;
    const t = b << 9;
    c ^= a;
    d ^= b;
    b ^= c;
    a ^= d;
    c ^= t;
    d = rotl(d, 11);
    return result / 2 ** 32;
  };
}

function rotl(x: number, k: number): number {
  return (x << k) | (x >>> (32 - k));
}

/** A uniformly random permutation of 0..n-1 (Fisher–Yates shuffle, common practice). */
export function randomPermutation(n: number, random: Random): Int32Array {
  const perm = Int32Array.from({ length: n }, (_, i) => i);
  for (let i = n - 1; i > 0; i--) {
    const j = Math.floor(random() * (i + 1));
    [perm[i], perm[j]] = [perm[j], perm[i]];
  }
  return perm;
}

/** A standard normal number from two uniforms (Box–Muller transform; common practice). */
export function standardNormal(random: Random): number {
  return Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
}

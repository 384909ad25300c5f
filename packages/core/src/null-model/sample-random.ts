import { uniformInt } from "pure-rand/distribution/uniformInt";
import { xoroshiro128plus } from "pure-rand/generator/xoroshiro128plus";
import type { RandomGenerator } from "pure-rand/types/RandomGenerator";

/**
 * The random source of one null-model sample: xoroshiro128+ (D. Blackman, S. Vigna, 2018) from the
 * pure-rand library, seeded from (seed, sample) through MurmurHash3's 32-bit finaliser so that every sample
 * has its own stream, whatever order or thread it is drawn in. Only integer arithmetic is used, so a seed
 * gives the same samples on every machine.
 */
export interface SampleRandom {
  /** A uniform integer in [0, n), n ≥ 1. */
  below(n: number): number;
  /** A uniform 32-bit integer in [0, 2^32). */
  uint32(): number;
}

export function sampleRandom(seed: number, sample: number): SampleRandom {
  if (!Number.isSafeInteger(seed) || !Number.isSafeInteger(sample))
    throw new RangeError(`seed and sample must be integers, got ${seed} and ${sample}`);
  const mixed = fmix32(
    fmix32(seed >>> 0) ^ fmix32(Math.floor(seed / 2 ** 32) + 0x9e3779b9) ^ fmix32(sample + 0x7f4a7c15),
  );
  const rng: RandomGenerator = xoroshiro128plus(mixed | 0);
  // The first outputs of xoroshiro from a small state are correlated with the seed: skip them.
  for (let i = 0; i < 16; i++) rng.next();
  return {
    below: (n) => uniformInt(rng, 0, n - 1),
    uint32: () => rng.next() >>> 0,
  };
}

/** MurmurHash3's 32-bit finaliser (A. Appleby, public domain), an integer bijection that mixes all bits. */
function fmix32(h: number): number {
  h = Math.imul(h ^ (h >>> 16), 0x85ebca6b);
  h = Math.imul(h ^ (h >>> 13), 0xc2b2ae35);
  return (h ^ (h >>> 16)) >>> 0;
}

// Seeded pseudo-random numbers for the benchmark graphs: xoshiro128** (D. Blackman and S. Vigna,
// "Scrambled linear pseudorandom number generators", 2018), seeded through splitmix32.

export function seededRandom(seed) {
  let z = seed >>> 0;
  const split = () => {
    z = (z + 0x9e3779b9) >>> 0;
    let t = z ^ (z >>> 16);
    t = Math.imul(t, 0x21f0aaad);
    t ^= t >>> 15;
    t = Math.imul(t, 0x735a2d97);
    return (t ^ (t >>> 15)) >>> 0;
  };
  let a = split();
  let b = split();
  let c = split();
  let d = split();
  /** Uniform in (0, 1), never 0 or 1. */
  return () => {
    const r = Math.imul(rotl(Math.imul(b, 5), 7), 9);
    const t = b << 9;
    c ^= a;
    d ^= b;
    b ^= c;
    a ^= d;
    c ^= t;
    d = rotl(d, 11);
    return ((r >>> 0) + 0.5) / 4294967296;
  };
}

function rotl(x, k) {
  return (x << k) | (x >>> (32 - k));
}

/** Number of failures before the next success of a Bernoulli(p) sequence (geometric skip). */
export function geometricSkip(random, p) {
  if (p >= 1) return 0;
  return Math.floor(Math.log(random()) / Math.log1p(-p));
}

import type { Barcode } from "../homology/barcode.js";

/** Numbers read off the bars of one homology dimension. Persistence is in weight units. */
export interface BarSummary {
  /** Finite bars (zero-length bars are already left out of barcodes by default). */
  readonly count: number;
  /** Bars that never die. */
  readonly essential: number;
  /** Σ |death − birth| over finite bars. */
  readonly totalPersistence: number;
  /** Largest |death − birth| over finite bars (0 when there are none). */
  readonly maxPersistence: number;
  /** Persistence entropy of the finite bars (0 when their total length is 0). */
  readonly entropy: number;
}

/**
 * Summary of the bars of dimension `dim`. Essential bars are counted apart and left out of the sums:
 * their length is infinite, and cutting them at an arbitrary end would make the number depend on that end.
 */
export function summarizeBars(barcode: Barcode, dim: number): BarSummary {
  const lengths: number[] = [];
  let essential = 0;
  let total = 0;
  let longest = 0;
  for (const bar of barcode.bars) {
    if (bar.dim !== dim) continue;
    if (bar.death === null) {
      essential++;
      continue;
    }
    const length = Math.abs(bar.death - bar.birth);
    lengths.push(length);
    total += length;
    if (length > longest) longest = length;
  }
  return {
    count: lengths.length,
    essential,
    totalPersistence: total,
    maxPersistence: longest,
    entropy: persistenceEntropy(lengths),
  };
}

/**
 * Persistence entropy H = −Σ (ℓ_i / L) ln(ℓ_i / L) of bar lengths ℓ_i with L = Σ ℓ_i, natural log;
 * 0 for no bars or L = 0. N. Atienza, R. Gonzalez-Diaz, M. Rucco, "Persistent entropy for separating
 * topological features from noise in Vietoris-Rips complexes", J. Intell. Inf. Syst. (2019) — reference
 * recalled from memory.
 */
export function persistenceEntropy(lengths: ArrayLike<number>): number {
  let total = 0;
  for (let i = 0; i < lengths.length; i++) total += lengths[i];
  if (!(total > 0)) return 0;
  let entropy = 0;
  for (let i = 0; i < lengths.length; i++) {
    const share = lengths[i] / total;
    if (share > 0) entropy -= share * Math.log(share);
  }
  return entropy;
}

import { isPrime, MAX_PRIME } from "../homology/prime-field.js";

/** Which column families a graph's feature row holds. */
export interface FeatureFamilies {
  /** Simplex-count curves, one per dimension 1..topDim. */
  readonly simplexCounts: boolean;
  /** Euler characteristic curve. */
  readonly euler: boolean;
  /** Betti curves, one per homology dimension 0..topDim−1. */
  readonly betti: boolean;
  /** Maximum, where it is first reached, and area of every curve (counts, Euler, Betti). */
  readonly curveSummaries: boolean;
  /** Number of bars, essential bars, total and maximum persistence, persistence entropy per dimension. */
  readonly barcodeSummaries: boolean;
  /** Plain network statistics; computed outside core (see @cliquescape/io networkStatistics). */
  readonly network: boolean;
}

/**
 * Which filtration the barcode (and so the Betti curves and bar summaries) is taken of: "axis" stops at the
 * axis's last threshold, the range the curves cover; "full" goes on until every edge is in. Betti curves on
 * the axis are the same either way. With "axis", a class still alive at the axis end counts as essential.
 * "full" can cost far more: a dense graph's complete complex has every tetrahedron of its nodes.
 */
export type BarcodeRange = "axis" | "full";

export interface FeatureConfig {
  readonly families: FeatureFamilies;
  /** Simplices are counted up to this dimension; Betti numbers and bars cover dimensions 0..topDim−1. */
  readonly topDim: number;
  /** Coefficients Z/p of the homology. */
  readonly prime: number;
  /** Filtration range of the barcode; default "axis". */
  readonly barcodeRange?: BarcodeRange;
}

/** A first run: every family on, triangles of triangles (3-simplices) counted, H0..H2 over Z/2. */
export const DEFAULT_FEATURE_CONFIG: FeatureConfig = Object.freeze({
  families: Object.freeze({
    simplexCounts: true,
    euler: true,
    betti: true,
    curveSummaries: true,
    barcodeSummaries: true,
    network: true,
  }),
  topDim: 3,
  prime: 2,
  barcodeRange: "axis",
});

/** Throws a RangeError naming the first setting that cannot be used. */
export function checkFeatureConfig(config: FeatureConfig): void {
  const { topDim, prime } = config;
  if (!Number.isInteger(topDim) || topDim < 1) {
    throw new RangeError(`topDim must be an integer ≥ 1 (edges at least), got ${topDim}`);
  }
  const range = config.barcodeRange ?? "axis";
  if (range !== "axis" && range !== "full")
    throw new RangeError(`barcodeRange must be "axis" or "full", got "${range}"`);
  if (!isPrime(prime) || prime > MAX_PRIME) {
    throw new RangeError(`prime must be a prime between 2 and ${MAX_PRIME}, got ${prime}`);
  }
}

/** Whether the barcode is needed: Betti curves, their summaries and bar summaries all come from it. */
export function needsBarcode(config: FeatureConfig): boolean {
  const f = config.families;
  return f.betti || f.curveSummaries || f.barcodeSummaries;
}

/** Whether the simplex-count sweep is needed. */
export function needsSweep(config: FeatureConfig): boolean {
  const f = config.families;
  return f.simplexCounts || f.euler || f.curveSummaries;
}

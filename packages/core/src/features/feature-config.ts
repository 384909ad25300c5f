import { isPrime, MAX_PRIME } from "../homology/prime-field.js";
import { PERSISTENCE_CURVE_KINDS, type PersistenceCurveKind } from "../vectorise/persistence-curve.js";
import type { EssentialHandling } from "../vectorise/windowed-diagram.js";

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
  /** Persistence landscapes, first layers sampled on the axis, per homology dimension (off by default). */
  readonly landscapes?: boolean;
  /** Persistence images on a fixed pixel grid over the axis window, per homology dimension (off by default). */
  readonly images?: boolean;
  /** Persistence entropy of the bars seen through the axis window, per homology dimension (off by default). */
  readonly entropy?: boolean;
  /** Persistence curves (lifespan, normalised lifespan, entropy) on the axis, per dimension (off by default). */
  readonly persistenceCurves?: boolean;
}

/**
 * Settings of the vectorisation families. They read the barcode through the axis window (see
 * windowedDiagram): bars are clipped to the axis range, so every graph's vectors share one grid.
 */
export interface VectorisationConfig {
  /** Bars that never die: "cut" at the axis's last value, or "drop" them. Default "cut". */
  readonly essential: EssentialHandling;
  /** Landscape layers λ_1 … λ_k kept. Default 3. */
  readonly landscapeLayers: number;
  /** Pixels along birth and along persistence (a square image). Default 10. */
  readonly imageResolution: number;
  /** Gaussian deviation as a fraction of the axis span; null: one pixel (span / resolution). Default null. */
  readonly imageSigma: number | null;
  /** Weight of a point: "linear" in persistence (0 on the diagonal, 1 at the full span) or "none". */
  readonly imageWeighting: "linear" | "none";
  /** Which persistence curves, in this order. Default all three. */
  readonly curves: readonly PersistenceCurveKind[];
}

export const DEFAULT_VECTORISATION: VectorisationConfig = Object.freeze({
  essential: "cut",
  landscapeLayers: 3,
  imageResolution: 10,
  imageSigma: null,
  imageWeighting: "linear",
  curves: PERSISTENCE_CURVE_KINDS,
});

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
  /** Settings of the vectorisation families; missing fields take DEFAULT_VECTORISATION's. */
  readonly vectorisation?: Partial<VectorisationConfig>;
}

/** The vectorisation settings of a configuration, defaults filled in. */
export function vectorisationOf(config: FeatureConfig): VectorisationConfig {
  return { ...DEFAULT_VECTORISATION, ...config.vectorisation };
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
  const v = vectorisationOf(config);
  if (v.essential !== "cut" && v.essential !== "drop")
    throw new RangeError(`vectorisation.essential must be "cut" or "drop", got "${v.essential}"`);
  if (!Number.isInteger(v.landscapeLayers) || v.landscapeLayers < 1 || v.landscapeLayers > 100)
    throw new RangeError(
      `vectorisation.landscapeLayers must be an integer in 1..100, got ${v.landscapeLayers}`,
    );
  if (!Number.isInteger(v.imageResolution) || v.imageResolution < 1 || v.imageResolution > 200)
    throw new RangeError(
      `vectorisation.imageResolution must be an integer in 1..200, got ${v.imageResolution}`,
    );
  if (v.imageSigma !== null && !(v.imageSigma > 0 && Number.isFinite(v.imageSigma)))
    throw new RangeError(`vectorisation.imageSigma must be a positive number or null, got ${v.imageSigma}`);
  if (v.imageWeighting !== "linear" && v.imageWeighting !== "none")
    throw new RangeError(
      `vectorisation.imageWeighting must be "linear" or "none", got "${v.imageWeighting}"`,
    );
  for (const kind of v.curves) {
    if (!(PERSISTENCE_CURVE_KINDS as readonly string[]).includes(kind))
      throw new RangeError(
        `unknown persistence curve "${kind}"; choose from ${PERSISTENCE_CURVE_KINDS.join(", ")}`,
      );
  }
}

/** Whether a vectorisation family is on. */
export function needsVectorisation(config: FeatureConfig): boolean {
  const f = config.families;
  return Boolean(f.landscapes || f.images || f.entropy || f.persistenceCurves);
}

/** Whether the barcode is needed: Betti curves, their summaries and bar summaries all come from it. */
export function needsBarcode(config: FeatureConfig): boolean {
  const f = config.families;
  return f.betti || f.curveSummaries || f.barcodeSummaries || needsVectorisation(config);
}

/** Whether the simplex-count sweep is needed. */
export function needsSweep(config: FeatureConfig): boolean {
  const f = config.families;
  return f.simplexCounts || f.euler || f.curveSummaries;
}

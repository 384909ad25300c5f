import { normalMass } from "./error-function.js";

export interface PersistenceImageOptions {
  /** Pixel edges along birth: [from, to], split into `resolution[0]` equal pixels. */
  readonly birthRange: readonly [number, number];
  /** Pixel edges along persistence (death − birth): [from, to], split into `resolution[1]` pixels. */
  readonly persistenceRange: readonly [number, number];
  readonly resolution: readonly [number, number];
  /** Standard deviation of the Gaussian around each point, in the diagram's units. */
  readonly sigma: number;
  /**
   * Weight of a point of persistence p: "linear" is p / rampEnd, capped at 1 (0 on the diagonal, so short
   * bars matter little); "none" weighs every point 1.
   */
  readonly weighting: "linear" | "none";
  /** Where the linear weight reaches 1 (default: persistenceRange[1]). */
  readonly rampEnd?: number;
}

/**
 * Persistence image (H. Adams, T. Emerson, M. Kirby, R. Neville, C. Peterson, P. Shipman, S. Chepushtanova,
 * E. Hanson, F. Motta, L. Ziegelmeier, "Persistence images: a stable vector representation of persistent
 * homology", JMLR 18, 2017): each point (b, d) goes to (b, p = d − b) and spreads as a Gaussian of
 * deviation σ with mass w(p); a pixel holds the exact integral of the sum of those surfaces over its
 * square, Σ_i w(p_i) · ΔΦ_birth · ΔΦ_persistence, the Gaussian being separable. Row-major
 * [birth pixel][persistence pixel]. When the pixels cover every point with a few σ to spare, the pixels
 * sum to Σ w(p_i) up to the Gaussian tails.
 */
export function persistenceImage(
  births: ArrayLike<number>,
  deaths: ArrayLike<number>,
  options: PersistenceImageOptions,
): Float64Array {
  const [nb, np] = options.resolution;
  const [b0, b1] = options.birthRange;
  const [p0, p1] = options.persistenceRange;
  const { sigma } = options;
  if (!(Number.isInteger(nb) && Number.isInteger(np) && nb >= 1 && np >= 1))
    throw new RangeError(`resolution must be two integers ≥ 1, got ${nb} × ${np}`);
  if (!(b1 > b0 && p1 > p0)) throw new RangeError("pixel ranges must be increasing");
  // An infinite width (an infinite end, or finite ends 2e308 apart) makes every pixel edge NaN (0 × ∞).
  if (!(Number.isFinite(b1 - b0) && Number.isFinite(p1 - p0)))
    throw new RangeError(`pixel ranges must have finite widths, got [${b0}, ${b1}] × [${p0}, ${p1}]`);
  if (!(sigma > 0 && Number.isFinite(sigma))) throw new RangeError(`sigma must be positive, got ${sigma}`);
  const rampEnd = options.rampEnd ?? p1;
  const image = new Float64Array(nb * np);
  const alongBirth = new Float64Array(nb);
  const alongPersistence = new Float64Array(np);
  const bw = (b1 - b0) / nb;
  const pw = (p1 - p0) / np;
  for (let i = 0; i < births.length; i++) {
    const b = births[i];
    const p = deaths[i] - b;
    const weight = options.weighting === "none" ? 1 : Math.min(1, Math.max(0, p / rampEnd));
    if (weight === 0) continue;
    for (let x = 0; x < nb; x++)
      alongBirth[x] = normalMass(b0 + x * bw, x === nb - 1 ? b1 : b0 + (x + 1) * bw, b, sigma);
    for (let y = 0; y < np; y++)
      alongPersistence[y] = normalMass(p0 + y * pw, y === np - 1 ? p1 : p0 + (y + 1) * pw, p, sigma);
    for (let x = 0; x < nb; x++) {
      const row = weight * alongBirth[x];
      if (row === 0) continue;
      for (let y = 0; y < np; y++) image[x * np + y] += row * alongPersistence[y];
    }
  }
  return image;
}

import type { WindowedDiagram } from "./windowed-diagram.js";

/**
 * Kinds of persistence curve (Y.-M. Chung, A. Lawson, "Persistence curves: a canonical framework for
 * summarizing persistence diagrams", Adv. Comput. Math. 48, 2022): the sum, over the points alive at t,
 * of ψ(b, d) with ℓ = d − b and L = Σ ℓ over the diagram —
 * - "lifespan": ψ = ℓ;
 * - "normalised-lifespan": ψ = ℓ / L;
 * - "entropy": ψ = −(ℓ / L) ln(ℓ / L).
 * (ψ = 1 gives the Betti curve, a family of its own.)
 */
export const PERSISTENCE_CURVE_KINDS = ["lifespan", "normalised-lifespan", "entropy"] as const;
export type PersistenceCurveKind = (typeof PERSISTENCE_CURVE_KINDS)[number];

/**
 * A persistence curve sampled at axis positions. A point is alive at t when b ≤ t < d, or at the window's
 * end when the bar goes on past it (`open`), as in the Betti curves; lengths are those of the windowed
 * bars. 0 everywhere when L = 0.
 */
export function persistenceCurve(
  diagram: WindowedDiagram,
  kind: PersistenceCurveKind,
  samples: ArrayLike<number>,
): Float64Array {
  const { births, deaths, open, span } = diagram;
  let total = 0;
  for (let i = 0; i < births.length; i++) total += deaths[i] - births[i];
  const out = new Float64Array(samples.length);
  if (!(total > 0)) return out;
  for (let s = 0; s < samples.length; s++) {
    const t = samples[s];
    let sum = 0;
    for (let i = 0; i < births.length; i++) {
      if (!(births[i] <= t && (t < deaths[i] || (open[i] === 1 && t >= span)))) continue;
      const length = deaths[i] - births[i];
      if (kind === "lifespan") sum += length;
      else {
        const share = length / total;
        sum += kind === "normalised-lifespan" ? share : -share * Math.log(share);
      }
    }
    out[s] = sum;
  }
  return out;
}

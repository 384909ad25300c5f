/**
 * What a weight means. Distance-like: small is close, edges enter in increasing weight, threshold W keeps
 * w ≤ W. Similarity-like: large is strong, edges enter strongest first, threshold W keeps w ≥ W.
 *
 * Internally every algorithm works with an ascending filtration value f: f = w for distances, f = −w for
 * similarities. These two functions are the only place that mapping lives.
 */
export type WeightSemantics = "distance" | "similarity";

/** Filtration value of a weight (or of a threshold) given in the user's units. */
export function toFiltrationValue(weight: number, semantics: WeightSemantics): number {
  return semantics === "distance" ? weight : -weight;
}

/** The user's weight (or threshold) for a filtration value. */
export function fromFiltrationValue(f: number, semantics: WeightSemantics): number {
  return semantics === "distance" ? f : -f;
}

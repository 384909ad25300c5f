/** How to make an asymmetric matrix undirected; "error" refuses it. */
export type SymmetrizePolicy = "error" | "max" | "min" | "mean";

/**
 * What to do with negative weights: refuse them, take absolute values, drop those edges, or keep them
 * as they are (meaningful for distance-like weights whose filtration may start below zero).
 */
export type NegativePolicy = "error" | "abs" | "drop" | "keep";

/** Called with a human-readable note for things that are fixed silently (self-loops dropped, …). */
export type WarningSink = (message: string) => void;

/** Tells the warning sink what a negative-weight policy did to `count` edges ("error" and "keep": nothing). */
export function noteNegatives(
  count: number,
  policy: NegativePolicy,
  onWarning: WarningSink | undefined,
): void {
  if (count === 0 || !onWarning) return;
  const edges = `${count} edge${count === 1 ? "" : "s"}`;
  if (policy === "drop") onWarning(`dropped ${edges} with a negative weight`);
  else if (policy === "abs") onWarning(`took the absolute value of the negative weight of ${edges}`);
}

/** How to make an asymmetric matrix undirected; "error" refuses it. */
export type SymmetrizePolicy = "error" | "max" | "min" | "mean";

/**
 * What to do with negative weights: refuse them, take absolute values, drop those edges, or keep them
 * as they are (meaningful for distance-like weights whose filtration may start below zero).
 */
export type NegativePolicy = "error" | "abs" | "drop" | "keep";

/** Called with a human-readable note for things that are fixed silently (self-loops dropped, …). */
export type WarningSink = (message: string) => void;

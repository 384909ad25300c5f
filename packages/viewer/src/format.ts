import type { WeightSemantics } from "@cliquescape/core";

/** A weight in 4 significant digits, without trailing zeros: what a person reads on an axis or a slider. */
export function formatWeight(w: number): string {
  if (!Number.isFinite(w)) return String(w);
  if (w === 0) return "0";
  const text = Math.abs(w) >= 1e5 || Math.abs(w) < 1e-3 ? w.toExponential(3) : w.toPrecision(4);
  return text.includes("e") ? text.replace(/\.?0+e/, "e") : text.replace(/\.?0+$/, "");
}

/** "w ≥ 0.62" or "w ≤ 3.1": which edges a threshold keeps. */
export function keepRule(threshold: number, semantics: WeightSemantics): string {
  return `${semantics === "similarity" ? "w ≥" : "w ≤"} ${formatWeight(threshold)}`;
}

export function formatCount(x: number): string {
  return x.toLocaleString("en-US");
}

/** Compact, exact-enough text for a weight or threshold: up to 6 significant digits, no trailing zeros. */
export function formatWeight(x: number): string {
  if (!Number.isFinite(x)) return x > 0 ? "∞" : "-∞";
  return String(Number(x.toPrecision(6)));
}

/** A count with thousands separators for tables (CSV and JSON keep plain numbers). */
export function formatCount(x: number): string {
  return x.toLocaleString("en-US");
}

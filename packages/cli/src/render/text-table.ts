/** Right-aligns numeric-looking cells, left-aligns the rest, two spaces between columns. */
export function textTable(header: readonly string[], rows: readonly (readonly string[])[]): string {
  // reduce, not Math.max(...): a sweep over 100,000 thresholds would overflow the call stack.
  const widths = header.map((h, c) => rows.reduce((w, r) => Math.max(w, r[c].length), h.length));
  const numeric = header.map(
    (_, c) => rows.length > 0 && rows.every((r) => /^[-+]?[\d.,e∞]+$|^–$/.test(r[c])),
  );
  const line = (cells: readonly string[]) =>
    cells
      .map((cell, c) => (numeric[c] ? cell.padStart(widths[c]) : cell.padEnd(widths[c])))
      .join("  ")
      .trimEnd();
  return [line(header), line(widths.map((w) => "─".repeat(w))), ...rows.map(line)].join("\n");
}

/** Key/value lines with the keys padded to one width. */
export function keyValueLines(pairs: readonly (readonly [string, string])[]): string {
  const width = pairs.reduce((w, [k]) => Math.max(w, k.length), 0);
  return pairs.map(([k, v]) => `${k.padEnd(width)}  ${v}`).join("\n");
}

/** Right-aligns numeric-looking cells, left-aligns the rest, two spaces between columns. */
export function textTable(header: readonly string[], rows: readonly (readonly string[])[]): string {
  const widths = header.map((h, c) => Math.max(h.length, ...rows.map((r) => r[c].length)));
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
  const width = Math.max(...pairs.map(([k]) => k.length));
  return pairs.map(([k, v]) => `${k.padEnd(width)}  ${v}`).join("\n");
}

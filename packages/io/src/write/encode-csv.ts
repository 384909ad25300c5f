/** A value in a CSV cell: null and undefined become an empty cell. */
export type CsvCell = string | number | boolean | null | undefined;

/**
 * Encodes a table as CSV text: comma-separated, "\n" line ends, a final newline. Cells are quoted as
 * RFC 4180 says (a cell holding a comma, a quote or a line break is put in double quotes, inner quotes
 * doubled), and also when they start or end with a space (readers trim unquoted cells) or start with
 * "#" (readers skip comment lines). Numbers are written with String(x), the shortest text that reads
 * back to the same float64.
 */
export function encodeCsv(header: readonly string[], rows: Iterable<readonly CsvCell[]>): string {
  const lines = [header.map(encodeCell).join(",")];
  let k = 0;
  for (const row of rows) {
    if (row.length !== header.length) {
      throw new RangeError(`row ${k} has ${row.length} cells but the header has ${header.length}`);
    }
    // A lone empty cell would be a blank line, which readers skip.
    lines.push(row.length === 1 && encodeCell(row[0]) === "" ? '""' : row.map(encodeCell).join(","));
    k++;
  }
  return `${lines.join("\n")}\n`;
}

/** One cell, quoted when needed. */
export function encodeCell(value: CsvCell): string {
  if (value === null || value === undefined) return "";
  const text = String(value);
  return needsQuotes(text) ? `"${text.replaceAll('"', '""')}"` : text;
}

function needsQuotes(text: string): boolean {
  return /[",\r\n]/.test(text) || text.startsWith("#") || text !== text.trim();
}

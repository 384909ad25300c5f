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
  let text = "";
  for (const chunk of encodeCsvChunks(header, rows)) text += chunk;
  return text;
}

// Rows are handed out in pieces of about this many characters.
const CHUNK_CHARACTERS = 1 << 16;

/**
 * The text of encodeCsv in pieces, produced as `rows` are consumed: a table of a million rows is written
 * to a file piece by piece (writeFileAtomic takes the pieces) and never exists as one string, which V8
 * caps at about 2^29 characters.
 */
export function* encodeCsvChunks(
  header: readonly string[],
  rows: Iterable<readonly CsvCell[]>,
): Generator<string> {
  let chunk = `${header.map(encodeCell).join(",")}\n`;
  let k = 0;
  for (const row of rows) {
    if (row.length !== header.length) {
      throw new RangeError(`row ${k} has ${row.length} cells but the header has ${header.length}`);
    }
    // A lone empty cell would be a blank line, which readers skip.
    chunk += row.length === 1 && encodeCell(row[0]) === "" ? '""\n' : `${row.map(encodeCell).join(",")}\n`;
    k++;
    if (chunk.length >= CHUNK_CHARACTERS) {
      yield chunk;
      chunk = "";
    }
  }
  yield chunk;
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

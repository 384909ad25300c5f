import { InputFileError } from "./input-file-error.js";

/** How cells are separated on a line. "whitespace" means runs of spaces and tabs. */
export type Delimiter = "," | "\t" | ";" | "whitespace";

/** One record of a text table: its 1-based starting line and its cells, trimmed. */
export interface TextRow {
  line: number;
  cells: string[];
}

/**
 * Blank lines and lines whose first non-blank character is # carry no data. In a TSV file a tab is a
 * delimiter, not blank: a line of tabs is a row of empty cells (a node without edges).
 */
function isSkipped(lineText: string, delimiter: Delimiter): boolean {
  const trimmed = delimiter === "\t" ? lineText.replace(/^ +| +$/g, "") : lineText.trim();
  return trimmed === "" || trimmed.startsWith("#");
}

/**
 * Guesses the delimiter from the first data line: a tab wins, then a comma, then a semicolon,
 * else whitespace. Tabs first because TSV label cells may contain commas. A line with semicolons whose
 * every comma sits between two digits is semicolon-separated with decimal commas (spreadsheets in many
 * locales): its delimiter is the semicolon, so that the cells, not their halves, are what gets refused.
 */
export function detectDelimiter(text: string): Delimiter {
  let pos = 0;
  while (pos < text.length) {
    let end = text.indexOf("\n", pos);
    if (end < 0) end = text.length;
    const lineText = text.slice(pos, end);
    if (!isSkipped(lineText, "whitespace")) {
      if (lineText.includes("\t")) return "\t";
      if (lineText.includes(";") && lineText.includes(",") && !/(?<!\d),|,(?!\d)/.test(lineText)) return ";";
      if (lineText.includes(",")) return ",";
      if (lineText.includes(";")) return ";";
      return "whitespace";
    }
    pos = end + 1;
  }
  return "whitespace";
}

/**
 * Yields the data records of a delimited text file, one at a time so that large matrices never exist as
 * one big array of strings. Delimited files follow RFC 4180 quoting (a quoted cell may hold the delimiter,
 * doubled quotes and line breaks); unquoted cells are trimmed of surrounding spaces (common practice).
 * Lines starting with # and blank lines are skipped; a leading UTF-8 byte-order mark is ignored.
 */
export function* textRows(text: string, delimiter: Delimiter, file: string): Generator<TextRow> {
  let pos = text.charCodeAt(0) === 0xfeff ? 1 : 0;
  let line = 1;
  while (pos < text.length) {
    let end = text.indexOf("\n", pos);
    if (end < 0) end = text.length;
    let lineText = text.slice(pos, end);
    if (lineText.endsWith("\r")) lineText = lineText.slice(0, -1);
    if (isSkipped(lineText, delimiter)) {
      pos = end + 1;
      line++;
      continue;
    }
    if (delimiter === "whitespace") {
      yield { line, cells: lineText.trim().split(/[ \t]+/) };
    } else if (!lineText.includes('"')) {
      yield { line, cells: lineText.split(delimiter).map((cell) => cell.trim()) };
    } else {
      const record = readQuotedRecord(text, pos, line, delimiter, file);
      yield { line, cells: record.cells };
      pos = record.next;
      line += record.lines;
      continue;
    }
    pos = end + 1;
    line++;
  }
}

/** Character-level reader for a record that contains quotes; returns where the next record starts. */
function readQuotedRecord(
  text: string,
  start: number,
  line: number,
  delimiter: string,
  file: string,
): { cells: string[]; next: number; lines: number } {
  const cells: string[] = [];
  let pos = start;
  let lines = 0;
  for (;;) {
    const cellLine = line + lines;
    while (text[pos] === " " || text[pos] === "\t") {
      if (text[pos] === delimiter) break;
      pos++;
    }
    let cell = "";
    if (text[pos] === '"') {
      pos++;
      for (;;) {
        if (pos >= text.length) {
          throw new InputFileError(file, "bad-quoting", "quoted cell is never closed", {
            line: cellLine,
            column: cells.length + 1,
          });
        }
        const ch = text[pos];
        if (ch === '"') {
          if (text[pos + 1] === '"') {
            cell += '"';
            pos += 2;
            continue;
          }
          pos++;
          break;
        }
        if (ch === "\n") lines++;
        cell += ch;
        pos++;
      }
      while (text[pos] === " " || (text[pos] === "\t" && delimiter !== "\t")) pos++;
      const after = text[pos];
      // A carriage return ends a record only as part of CRLF (RFC 4180); a lone one is text after the quote.
      const lineBreak = after === "\n" || (after === "\r" && text[pos + 1] === "\n");
      if (pos < text.length && after !== delimiter && !lineBreak) {
        throw new InputFileError(
          file,
          "bad-quoting",
          `unexpected ${JSON.stringify(after)} after the closing quote of a cell`,
          { line: line + lines, column: cells.length + 1 },
        );
      }
    } else {
      const from = pos;
      while (pos < text.length && text[pos] !== delimiter && text[pos] !== "\n") pos++;
      cell = text.slice(from, pos).trim();
      if (cell.includes('"')) {
        throw new InputFileError(
          file,
          "bad-quoting",
          "a quote inside an unquoted cell; quote the whole cell",
          {
            line: cellLine,
            column: cells.length + 1,
          },
        );
      }
    }
    cells.push(cell);
    if (text[pos] === delimiter) {
      pos++;
      continue;
    }
    if (text[pos] === "\r") pos++;
    if (text[pos] === "\n") pos++;
    return { cells, next: pos, lines: lines + 1 };
  }
}

/**
 * The records of a text table (see textRows) with the first one already read: a file without any is refused
 * here, once for every reader, saying whether it is empty or only holds blank and comment lines.
 */
export function tableRows(
  text: string,
  delimiter: Delimiter,
  file: string,
): { first: TextRow; rest: Generator<TextRow> } {
  const rest = textRows(text, delimiter, file);
  const next = rest.next();
  if (next.done) {
    const reason = text.length === 0 ? "file is empty" : "file holds no data, only blank or comment lines";
    throw new InputFileError(file, "empty-file", reason);
  }
  return { first: next.value, rest };
}

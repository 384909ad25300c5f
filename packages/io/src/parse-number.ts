/** What a table cell holds, for reading weights. */
export type CellValue =
  | { kind: "empty" }
  | { kind: "number"; value: number }
  | { kind: "not-finite"; value: number }
  | { kind: "text" };

// Decimal numbers as written by spreadsheets, numpy.savetxt, R and pandas (common practice).
const DECIMAL = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
// NaN and infinity as numpy, MATLAB, pandas and JavaScript spell them, and R's NA (common practice).
const NOT_A_NUMBER = /^[+-]?nan$/i;
const INFINITY = /^([+-]?)(?:inf|infinity)$/i;

/**
 * Classifies one trimmed cell. Stricter than `Number()`, which would read "" as 0 and "0x1A" as 26:
 * a cell is a number only if it is written as a decimal.
 */
export function classifyCell(cell: string): CellValue {
  if (cell === "") return { kind: "empty" };
  if (DECIMAL.test(cell)) return { kind: "number", value: Number(cell) };
  if (NOT_A_NUMBER.test(cell) || cell === "NA") return { kind: "not-finite", value: Number.NaN };
  const inf = INFINITY.exec(cell);
  if (inf) return { kind: "not-finite", value: inf[1] === "-" ? -Infinity : Infinity };
  return { kind: "text" };
}

/** A number written with a decimal comma ("0,5", "-,25"): never read as a number, but never a label either. */
export function isDecimalComma(cell: string): boolean {
  return /^[+-]?\d*,\d+$/.test(cell);
}

/**
 * What a text cell that is not a number probably is, for the error message: a decimal comma, or numbers
 * separated by spaces inside a tab-separated line. Empty when there is nothing to add.
 */
export function notANumberHint(cell: string, delimiter: string): string {
  if (isDecimalComma(cell)) return "; decimal commas are not read: write a decimal point (0.5)";
  if (delimiter === "\t" && cell.split(/[ \t]+/).every((part) => DECIMAL.test(part))) {
    return "; the line separates cells with spaces but the file with tabs: use one kind of separator throughout";
  }
  return "";
}

/** True for anything that reads as a number, including NaN and infinity: used to tell labels from data. */
export function looksNumeric(cell: string): boolean {
  const kind = classifyCell(cell).kind;
  return kind === "number" || kind === "not-finite";
}

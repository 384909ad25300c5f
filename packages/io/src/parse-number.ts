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

/** True for anything that reads as a number, including NaN and infinity: used to tell labels from data. */
export function looksNumeric(cell: string): boolean {
  const kind = classifyCell(cell).kind;
  return kind === "number" || kind === "not-finite";
}

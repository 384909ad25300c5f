import { formatPosition, InputFileError } from "@cliquescape/io";
import { cliMessage } from "../cli-message.js";

/** Why one graph was left out of the tables, with the place to look; one row of errors.csv. */
export interface GraphFailure {
  file: string;
  line: number | null;
  column: number | null;
  reason: string;
  /** Error class: InputFileError, GraphInputError, SimplexBudgetError, HomologyBudgetError, … */
  kind: string;
}

/**
 * Restates any error met while reading or computing one graph. Reader errors carry their own file and
 * line/column (binary files: the element and byte in the reason); builder errors name the matrix cell.
 */
export function graphFailureOf(error: unknown, file: string): GraphFailure {
  if (error instanceof InputFileError) {
    const { line, column, element, byteOffset } = error.position;
    const binary = line === undefined && (element !== undefined || byteOffset !== undefined);
    return {
      file: error.file,
      line: line ?? null,
      column: column ?? null,
      reason: cliMessage(
        binary ? `${error.reason} (${formatPosition(error.position).slice(2)})` : error.reason,
      ),
      kind: error.name,
    };
  }
  const name = error instanceof Error ? error.name : "Error";
  const message = error instanceof Error ? error.message : String(error);
  const location = (error as { location?: { row?: number; col?: number } }).location;
  const cell =
    location?.row !== undefined && location.col !== undefined
      ? ` (matrix row ${location.row + 1}, column ${location.col + 1})`
      : "";
  if (name === "TimeLimitError") {
    return {
      file,
      line: null,
      column: null,
      reason: `${message}; raise --time-limit (seconds, 0: no limit), lower --top-dim or keep fewer edges`,
      kind: name,
    };
  }
  const known = name.endsWith("BudgetError") || name === "GraphInputError" || name === "RangeError";
  return {
    file,
    line: null,
    column: null,
    reason: known ? cliMessage(`${message}${cell}`) : `unexpected ${name}: ${message} (please report this)`,
    kind: name,
  };
}

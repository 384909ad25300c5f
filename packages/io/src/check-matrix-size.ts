import { InputFileError, type InputFilePosition } from "./input-file-error.js";
import { DEFAULT_MAX_CELLS, type GraphReadOptions } from "./read-options.js";

/** Refuses an n×n matrix larger than the cell limit before anything of its size is allocated. */
export function checkMatrixSize(
  n: number,
  options: GraphReadOptions,
  file: string,
  position: InputFilePosition = {},
): void {
  const problem = matrixSizeProblem(n, n, options.maxCells ?? DEFAULT_MAX_CELLS);
  if (problem) throw new InputFileError(file, "too-large", problem, position);
}

/** Why a rows × cols matrix is over the cell limit, or undefined when it is not. */
export function matrixSizeProblem(rows: number, cols: number, maxCells: number): string | undefined {
  return rows * cols > maxCells
    ? `a ${rows}×${cols} matrix has ${rows * cols} cells, more than the limit of ${maxCells}; raise maxCells if you have the memory`
    : undefined;
}

import { InputFileError, type InputFilePosition } from "./input-file-error.js";
import { DEFAULT_MAX_CELLS, type GraphReadOptions } from "./read-options.js";

/** Refuses an n×n matrix larger than the cell limit before anything of its size is allocated. */
export function checkMatrixSize(
  n: number,
  options: GraphReadOptions,
  file: string,
  position: InputFilePosition = {},
): void {
  const maxCells = options.maxCells ?? DEFAULT_MAX_CELLS;
  if (n * n > maxCells) {
    throw new InputFileError(
      file,
      "too-large",
      `a ${n}×${n} matrix has ${n * n} cells, more than the limit of ${maxCells}; raise maxCells if you have the memory`,
      position,
    );
  }
}

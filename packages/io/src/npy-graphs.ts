import { fromDenseMatrix, GraphInputError, type WeightedGraph } from "@cliquescape/core";
import { asymmetryReason } from "./asymmetry-reason.js";
import { checkMatrixSize } from "./check-matrix-size.js";
import { InputFileError } from "./input-file-error.js";
import { nanCellsNote } from "./nan-cells-note.js";
import { readElement } from "./npy-dtype.js";
import { type NpyArray, npyElementOffset, npyStrides } from "./parse-npy.js";
import { type GraphReadOptions, nanIsNoEdge, negativePolicy, zeroIsEdge } from "./read-options.js";

/** Graphs read from one file: one for a matrix, k for a stack. */
export interface GraphsReadResult {
  graphs: WeightedGraph[];
  /** Notes for the user, without the file name; a stack's notes start "graph g of the stack: " (0-based g). */
  warnings: string[];
}

/**
 * Turns a .npy array into graphs: shape (n, n) gives one graph, (k, n, n) a stack of k graphs. The diagonal
 * is ignored; boolean arrays give weight-1 edges where true; a 0 is an edge only for distance-like weights
 * or with `zeroIsEdge`; NaN is no edge (counted in a warning) unless `nanIsNoEdge` is false.
 */
export function npyToGraphs(array: NpyArray, file: string, options: GraphReadOptions = {}): GraphsReadResult {
  const { shape, dtype } = array;
  const shapeText = `(${shape.join(", ")}${shape.length === 1 ? "," : ""})`;
  if (shape.length !== 2 && shape.length !== 3) {
    throw new InputFileError(
      file,
      "not-square",
      `array of shape ${shapeText} is neither a matrix (n, n) nor a stack of matrices (k, n, n)`,
    );
  }
  const stacked = shape.length === 3;
  const k = stacked ? shape[0] : 1;
  const n = shape[shape.length - 1];
  if (shape[shape.length - 2] !== n) {
    throw new InputFileError(file, "not-square", `matrices of shape ${shapeText} are not square`);
  }
  if (n === 0 || k === 0) {
    throw new InputFileError(
      file,
      "empty-file",
      `array of shape ${shapeText} holds no ${k === 0 ? "matrices" : "nodes"}: there is no graph to read`,
    );
  }
  checkMatrixSize(n, options, file);
  if (options.labels && options.labels.length !== n) {
    throw new InputFileError(
      file,
      "bad-labels",
      `${options.labels.length} labels given for a ${n}-node matrix`,
    );
  }
  const zeroEdge = zeroIsEdge(options) && dtype.kind !== "b";
  const nanNoEdge = nanIsNoEdge(options);
  const view = new DataView(array.bytes.buffer, array.bytes.byteOffset, array.bytes.byteLength);
  const warnings: string[] = [];
  if (array.trailingBytes > 0) {
    warnings.push(`ignored ${array.trailingBytes} bytes after the array data`);
  }
  let rounded = 0;
  const graphs: WeightedGraph[] = [];
  const values = new Float64Array(n * n);
  const strides = npyStrides(array);
  const [rowStride, colStride] = strides.slice(-2).map((s) => s * dtype.size);
  for (let g = 0; g < k; g++) {
    let nans = 0;
    const indexOf = (i: number, j: number) => (stacked ? [g, i, j] : [i, j]);
    const base = array.dataOffset + (stacked ? g * strides[0] * dtype.size : 0);
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        const offset = base + i * rowStride + j * colStride;
        let w = i === j ? Number.NaN : readElement(view, offset, dtype);
        if (w === 0 && !zeroEdge) w = Number.NaN;
        else if (Number.isNaN(w) && i !== j) {
          if (!nanNoEdge) {
            throw new InputFileError(
              file,
              "not-finite",
              'NaN is not a finite weight (set nanIsNoEdge to read NaN as "no edge")',
              { element: indexOf(i, j), byteOffset: offset },
            );
          }
          nans++;
        } else if (dtype.size === 8 && dtype.kind !== "f" && !Number.isSafeInteger(w) && !Number.isNaN(w)) {
          rounded++;
        }
        values[i * n + j] = w;
      }
    }
    const where = stacked ? `graph ${g} of the stack: ` : "";
    if (nans > 0) warnings.push(`${where}${nanCellsNote(nans)}`);
    try {
      graphs.push(
        fromDenseMatrix(n, values, {
          directed: options.directed ?? false,
          symmetrize: options.symmetrize,
          symmetryTolerance: options.symmetryTolerance,
          negative: negativePolicy(options),
          labels: options.labels,
          onWarning: (message) => warnings.push(`${where}${message}`),
        }),
      );
    } catch (error) {
      if (!(error instanceof GraphInputError)) throw error;
      const { row, col } = error.location;
      if (row === undefined || col === undefined) throw error;
      const position = { element: indexOf(row, col), byteOffset: npyElementOffset(array, indexOf(row, col)) };
      if (error.problem === "asymmetric") {
        throw new InputFileError(
          file,
          "asymmetric",
          asymmetryReason(
            values[row * n + col],
            values[col * n + row],
            `element (${indexOf(col, row).join(", ")})`,
            options.symmetryTolerance,
          ),
          position,
          { cause: error },
        );
      }
      const problem = error.problem === "negative-weight" ? "negative-weight" : "not-finite";
      throw new InputFileError(file, problem, error.message, position, { cause: error });
    }
  }
  if (rounded > 0) {
    warnings.push(`${rounded} 64-bit integer weights exceed 2^53 and were rounded to the nearest float64`);
  }
  return { graphs, warnings };
}

import type { WeightedGraph } from "@cliquescape/core";
import { InputFileError } from "../input-file-error.js";
import { type GraphsReadResult, npyToGraphs } from "../npy-graphs.js";
import { type NpyArray, npyStrides } from "../parse-npy.js";
import type { GraphReadOptions } from "../read-options.js";

/**
 * Which axis of a 3-D array counts the graphs: 0 for numpy's (k, n, n), 2 for MATLAB's n × n × k
 * (`A(:,:,k)` is graph k).
 */
export type StackAxis = 0 | 2;

/** How positions in an array are told to the user. */
export interface ArrayPlace {
  /** Prepended to every reason, e.g. 'array "X": '. */
  prefix: string;
  /** Whether byte offsets in the array's bytes are offsets in the file (false inside compressed members). */
  byteOffsetsInFile: boolean;
}

/** Number of graphs in a matrix (1) or stack (k) along `axis`. */
export function graphCount(array: NpyArray, axis: StackAxis): number {
  return array.shape.length === 3 ? array.shape[axis] : 1;
}

/**
 * Graph g of a 3-D array as a 2-D array. A contiguous slice (C order along axis 0, Fortran order along
 * axis 2) is a view of the same bytes; any other slice is gathered into new bytes, n·n elements.
 */
export function stackSlice(array: NpyArray, axis: StackAxis, g: number): NpyArray {
  const { shape, dtype } = array;
  const [rows, cols] = axis === 0 ? [shape[1], shape[2]] : [shape[0], shape[1]];
  const strides = npyStrides(array);
  const contiguous = axis === 0 ? !array.fortranOrder : array.fortranOrder;
  if (contiguous) {
    return {
      ...array,
      shape: [rows, cols],
      dataOffset: array.dataOffset + g * strides[axis] * dtype.size,
      trailingBytes: 0,
    };
  }
  const [rowStride, colStride] = axis === 0 ? [strides[1], strides[2]] : [strides[0], strides[1]];
  const bytes = new Uint8Array(rows * cols * dtype.size);
  const base = array.dataOffset + g * strides[axis] * dtype.size;
  for (let i = 0; i < rows; i++) {
    for (let j = 0; j < cols; j++) {
      const from = base + (i * rowStride + j * colStride) * dtype.size;
      bytes.set(array.bytes.subarray(from, from + dtype.size), (i * cols + j) * dtype.size);
    }
  }
  return { ...array, shape: [rows, cols], fortranOrder: false, dataOffset: 0, bytes, trailingBytes: 0 };
}

/** Graph g of a matrix (g = 0) or of a stack, with errors placed in the whole array. */
export function arrayGraph(
  array: NpyArray,
  axis: StackAxis,
  g: number,
  file: string,
  options: GraphReadOptions,
  place: ArrayPlace,
): { graph: WeightedGraph; warnings: string[] } {
  const stacked = array.shape.length === 3;
  if (!stacked) {
    const { graphs, warnings } = restate(
      () => npyToGraphs(array, file, options),
      file,
      place,
      (e) => e,
    );
    return { graph: graphs[0], warnings };
  }
  const slice = stackSlice(array, axis, g);
  const inFile = place.byteOffsetsInFile && slice.bytes === array.bytes;
  const full = (e: readonly number[]) => (axis === 0 ? [g, ...e] : [...e, g]);
  const { graphs, warnings } = restate(
    () => npyToGraphs(slice, file, options),
    file,
    { prefix: `${place.prefix}graph ${g} of the stack: `, byteOffsetsInFile: inFile },
    full,
  );
  return { graph: graphs[0], warnings: warnings.map((w) => `graph ${g} of the stack: ${w}`) };
}

/** Every graph of a matrix or stack. */
export function arrayGraphs(
  array: NpyArray,
  axis: StackAxis,
  file: string,
  options: GraphReadOptions,
  place: ArrayPlace,
): GraphsReadResult {
  const graphs: WeightedGraph[] = [];
  const warnings: string[] = [];
  if (array.shape.length !== 2 && array.shape.length !== 3) {
    restate(
      () => npyToGraphs(array, file, options),
      file,
      place,
      (e) => e,
    );
  }
  if (array.shape.length === 3 && graphCount(array, axis) === 0) {
    throw new InputFileError(
      file,
      "empty-file",
      `${place.prefix}array of shape (${array.shape.join(", ")}) holds no matrices: there is no graph to read`,
    );
  }
  for (let g = 0; g < graphCount(array, axis); g++) {
    const one = arrayGraph(array, axis, g, file, options, place);
    graphs.push(one.graph);
    warnings.push(...one.warnings);
  }
  return { graphs, warnings };
}

function restate<T>(
  read: () => T,
  file: string,
  place: ArrayPlace,
  element: (e: readonly number[]) => number[] | readonly number[],
): T {
  try {
    return read();
  } catch (error) {
    if (!(error instanceof InputFileError)) throw error;
    const position = {
      ...(error.position.element ? { element: element(error.position.element) } : {}),
      ...(place.byteOffsetsInFile && error.position.byteOffset !== undefined
        ? { byteOffset: error.position.byteOffset }
        : {}),
    };
    throw new InputFileError(file, error.problem, `${place.prefix}${error.reason}`, position);
  }
}

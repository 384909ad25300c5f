import type { NpyDtype } from "../npy-dtype.js";

// Numbers from the MATLAB 7 MAT-File Format document (MathWorks), "MAT-File Data Types" (table 1-1)
// and "MATLAB Array Types" (mxCLASS values, table 1-3).

export const MI_MATRIX = 14;
export const MI_COMPRESSED = 15;

/** Element data types that hold numbers, as this package's dtype (byte order filled in by the reader). */
export const NUMERIC_DATA_TYPES: Record<number, Pick<NpyDtype, "kind" | "size">> = {
  1: { kind: "i", size: 1 }, // miINT8
  2: { kind: "u", size: 1 }, // miUINT8
  3: { kind: "i", size: 2 }, // miINT16
  4: { kind: "u", size: 2 }, // miUINT16
  5: { kind: "i", size: 4 }, // miINT32
  6: { kind: "u", size: 4 }, // miUINT32
  7: { kind: "f", size: 4 }, // miSINGLE
  9: { kind: "f", size: 8 }, // miDOUBLE
  12: { kind: "i", size: 8 }, // miINT64
  13: { kind: "u", size: 8 }, // miUINT64
};

/** Whether a tag's type is one of the MAT-file data types (1–7, 9, 12–18; 8, 10 and 11 are reserved). */
export function isMatDataType(type: number): boolean {
  return (type >= 1 && type <= 7) || type === 9 || (type >= 12 && type <= 18);
}

/**
 * The rows and columns of each matrix of a 2-D variable or a 3-D stack (MATLAB's n × n × k, or a numpy
 * stack k × n × n saved by scipy: the first two dimensions differ and the last two agree).
 */
export function matrixDims(dims: readonly number[]): [number, number] | undefined {
  if (dims.length === 2) return [dims[0], dims[1]];
  if (dims.length !== 3) return undefined;
  return stackAxisOf(dims) === 0 ? [dims[1], dims[2]] : [dims[0], dims[1]];
}

/** Which dimension of a 3-D variable counts the graphs: 0 for a numpy stack k × n × n, else 2. */
export function stackAxisOf(dims: readonly number[]): 0 | 2 {
  return dims[0] !== dims[1] && dims[1] === dims[2] ? 0 : 2;
}

/** MATLAB class names by mxCLASS number. */
export const ARRAY_CLASSES: Record<number, string> = {
  1: "cell",
  2: "struct",
  3: "object",
  4: "char",
  5: "sparse",
  6: "double",
  7: "single",
  8: "int8",
  9: "uint8",
  10: "int16",
  11: "uint16",
  12: "int32",
  13: "uint32",
  14: "int64",
  15: "uint64",
  16: "function handle",
  17: "opaque",
};

/** Classes whose real part is a plain numeric array (mxDOUBLE_CLASS … mxUINT64_CLASS). */
export function isNumericClass(classNumber: number): boolean {
  return classNumber >= 6 && classNumber <= 15;
}

// Array flags: the class is the low byte; in the next byte 0x08 marks complex, 0x02 logical.
export const FLAG_COMPLEX = 0x08;
export const FLAG_LOGICAL = 0x02;

import { InputFileError, type InputFileProblem } from "./input-file-error.js";
import { type NpyDtype, parseDescr, readElement, SUPPORTED_DTYPES } from "./npy-dtype.js";
import { PythonLiteralError, type PythonValue, parsePythonLiteral } from "./python-literal.js";

/** What a .npy header says: everything but the data. */
export interface NpyHeader {
  /** Format version as "major.minor". */
  version: string;
  dtype: NpyDtype;
  fortranOrder: boolean;
  shape: number[];
  /** Byte offset of the first element: the header's length. */
  dataOffset: number;
  /** Bytes of data the shape and dtype call for. */
  dataBytes: number;
}

/** A .npy array, not yet copied: elements are read from `bytes` on demand. */
export interface NpyArray {
  /** Format version as "major.minor". */
  version: string;
  dtype: NpyDtype;
  fortranOrder: boolean;
  shape: number[];
  /** Byte offset of the first element in `bytes`. */
  dataOffset: number;
  bytes: Uint8Array;
  /** Bytes after the last element (numpy ignores them; readers should warn). */
  trailingBytes: number;
}

// NumPy format specification (NEP 1): the magic string is \x93NUMPY, then major and minor version bytes.
const MAGIC = [0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59];
// The keys numpy writes and requires, no more and no fewer (numpy.lib.format reads nothing else).
const HEADER_KEYS = ["descr", "fortran_order", "shape"];

/**
 * Parses the header of a .npy file (format versions 1.0, 2.0 and 3.0 of the NumPy format specification)
 * and checks that the data the header promises is all there, before anything is allocated.
 */
export function parseNpy(bytes: Uint8Array, file: string): NpyArray {
  const header = parseNpyHeader(bytes, file);
  const available = bytes.length - header.dataOffset;
  if (header.dataBytes > available) {
    throw new InputFileError(
      file,
      "truncated",
      `file is truncated: shape ${tupleText(header.shape)} of ${header.dtype.descr} needs ${header.dataBytes} bytes of data after ` +
        `byte ${header.dataOffset}, but only ${available} are there`,
      { byteOffset: bytes.length },
    );
  }
  return {
    version: header.version,
    dtype: header.dtype,
    fortranOrder: header.fortranOrder,
    shape: header.shape,
    dataOffset: header.dataOffset,
    bytes,
    trailingBytes: available - header.dataBytes,
  };
}

/**
 * Where the header of a .npy file ends (its data offset), from its first 12 bytes; undefined when they are
 * too few or not a .npy start (parseNpyHeader then says what is wrong). Lets a reader fetch just the header.
 */
export function npyHeaderEnd(start: Uint8Array): number | undefined {
  if (start.length < 10 || MAGIC.some((b, k) => start[k] !== b)) return undefined;
  const view = new DataView(start.buffer, start.byteOffset, start.byteLength);
  if (start[6] === 1) return 10 + view.getUint16(8, true);
  return start.length < 12 ? undefined : 12 + view.getUint32(8, true);
}

/**
 * Parses and checks a .npy header, given at least the bytes up to its end (the data need not be there).
 * The header must be a dict with exactly the keys descr, fortran_order and shape, as numpy requires.
 */
export function parseNpyHeader(bytes: Uint8Array, file: string): NpyHeader {
  const fail = (problem: InputFileProblem, reason: string, byteOffset?: number): never => {
    throw new InputFileError(file, problem, reason, byteOffset === undefined ? {} : { byteOffset });
  };
  if (bytes.length === 0) fail("empty-file", "file is empty (0 bytes)");
  for (let k = 0; k < MAGIC.length; k++) {
    if (k >= bytes.length)
      fail("truncated", `file is truncated: ${bytes.length} bytes, inside the .npy magic string`);
    if (bytes[k] !== MAGIC[k]) fail("bad-npy", 'not a .npy file: it does not start with "\\x93NUMPY"', k);
  }
  if (bytes.length < 8)
    fail("truncated", `file is truncated: ${bytes.length} bytes, before the version number`);
  const major = bytes[6];
  const minor = bytes[7];
  if (major < 1 || major > 3 || minor !== 0) {
    fail(
      "bad-npy",
      `unsupported .npy format version ${major}.${minor} (this reader knows 1.0, 2.0 and 3.0)`,
      6,
    );
  }
  // Version 1.0 stores the header length as a little-endian uint16, later versions as a uint32.
  const lengthBytes = major === 1 ? 2 : 4;
  const headerStart = 8 + lengthBytes;
  if (bytes.length < headerStart) {
    fail("truncated", `file is truncated: ${bytes.length} bytes, inside the header length field`);
  }
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const headerLength = major === 1 ? view.getUint16(8, true) : view.getUint32(8, true);
  const dataOffset = headerStart + headerLength;
  if (dataOffset > bytes.length) {
    fail(
      "truncated",
      `file is truncated: the header claims ${headerLength} bytes, ending at byte ${dataOffset}, but the file has ${bytes.length}`,
      8,
    );
  }
  // Versions 1.0 and 2.0 encode the header in latin-1, version 3.0 in UTF-8.
  const headerText = new TextDecoder(major === 3 ? "utf-8" : "latin1").decode(
    bytes.subarray(headerStart, dataOffset),
  );
  let header: PythonValue;
  try {
    header = parsePythonLiteral(headerText);
  } catch (error) {
    if (!(error instanceof PythonLiteralError)) throw error;
    // The parser counts characters; a UTF-8 (3.0) header may spend several bytes on one.
    const before = headerText.slice(0, error.offset);
    const byte = headerStart + (major === 3 ? new TextEncoder().encode(before).length : before.length);
    return fail("bad-npy", `header is not a valid dictionary: ${error.message}`, byte);
  }
  if (header === null || typeof header !== "object" || Array.isArray(header)) {
    return fail("bad-npy", "header is not a dictionary", headerStart);
  }
  const keys = Object.keys(header).sort();
  if (keys.join("\u0000") !== HEADER_KEYS.join("\u0000")) {
    fail(
      "bad-npy",
      `header keys are ${keys.length === 0 ? "none" : keys.map((k) => `'${k}'`).join(", ")}; a .npy header has exactly 'descr', 'fortran_order' and 'shape' (numpy refuses any other set)`,
      headerStart,
    );
  }
  const { descr, fortran_order: fortranOrder, shape } = header;
  if (typeof descr !== "string") {
    const what = Array.isArray(descr)
      ? "structured (record) arrays are not supported"
      : "header has no 'descr' string";
    fail(Array.isArray(descr) ? "unsupported-dtype" : "bad-npy", what, headerStart);
  }
  const dtype = parseDescr(descr as string);
  if (!dtype) {
    throw new InputFileError(
      file,
      "unsupported-dtype",
      `unsupported dtype ${JSON.stringify(descr)}; supported: ${SUPPORTED_DTYPES}`,
      { byteOffset: headerStart },
    );
  }
  if (typeof fortranOrder !== "boolean")
    fail("bad-npy", "header has no 'fortran_order' True/False", headerStart);
  if (!Array.isArray(shape)) return fail("bad-npy", "header 'shape' is not a tuple", headerStart);
  const shapeText = tupleText(shape);
  if (shape.some((d) => typeof d === "bigint" && d > 0n)) {
    fail(
      "too-large",
      `header shape ${shapeText} has a dimension above 2^53: more data than any file can hold`,
      headerStart,
    );
  }
  if (!shape.every((d) => typeof d === "number" && Number.isSafeInteger(d) && d >= 0)) {
    return fail(
      "bad-npy",
      `header 'shape' ${shapeText} is not a tuple of non-negative integers`,
      headerStart,
    );
  }
  const dims = shape as number[];
  // Multiply with a bound so a forged shape like (10**12, 10**12) is refused without overflow or allocation.
  let elements = 1;
  for (const d of dims) {
    elements *= d;
    if (elements * dtype.size > Number.MAX_SAFE_INTEGER) {
      fail("too-large", `header shape ${shapeText} describes more data than any file can hold`, headerStart);
    }
  }
  return {
    version: `${major}.${minor}`,
    dtype,
    fortranOrder: fortranOrder as boolean,
    shape: dims,
    dataOffset,
    dataBytes: elements * dtype.size,
  };
}

/** A shape as Python writes a tuple, as the header does: "(3,)" for one dimension, "()" for none. */
function tupleText(shape: readonly unknown[]): string {
  return `(${shape.map(String).join(", ")}${shape.length === 1 ? "," : ""})`;
}

/** Element strides per axis: how many elements apart neighbours along each axis lie, in C or Fortran order. */
export function npyStrides(array: Pick<NpyArray, "shape" | "fortranOrder">): number[] {
  const { shape, fortranOrder } = array;
  const strides = new Array<number>(shape.length);
  let step = 1;
  for (let k = 0; k < shape.length; k++) {
    const axis = fortranOrder ? k : shape.length - 1 - k;
    strides[axis] = step;
    step *= shape[axis];
  }
  return strides;
}

/** Byte offset of the element at `index` (one number per axis), honouring C or Fortran order. */
export function npyElementOffset(array: NpyArray, index: readonly number[]): number {
  const strides = npyStrides(array);
  let flat = 0;
  for (let axis = 0; axis < index.length; axis++) flat += index[axis] * strides[axis];
  return array.dataOffset + flat * array.dtype.size;
}

/** All elements as float64 in C (row-major) order, whatever the file's order and type. */
export function npyValues(array: NpyArray): Float64Array {
  const count = array.shape.reduce((a, b) => a * b, 1);
  const out = new Float64Array(count);
  const view = new DataView(array.bytes.buffer, array.bytes.byteOffset, array.bytes.byteLength);
  const index = new Array<number>(array.shape.length).fill(0);
  for (let k = 0; k < count; k++) {
    out[k] = readElement(view, npyElementOffset(array, index), array.dtype);
    for (let axis = index.length - 1; axis >= 0; axis--) {
      if (++index[axis] < array.shape[axis]) break;
      index[axis] = 0;
    }
  }
  return out;
}

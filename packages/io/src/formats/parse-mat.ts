import { Unzlib } from "fflate";
import { matrixSizeProblem } from "../check-matrix-size.js";
import { InputFileError, type InputFileProblem } from "../input-file-error.js";
import type { NpyArray } from "../parse-npy.js";
import { DEFAULT_MAX_CELLS, formatBytes } from "../read-options.js";
import {
  ARRAY_CLASSES,
  FLAG_COMPLEX,
  FLAG_LOGICAL,
  isMatDataType,
  isNumericClass,
  MI_COMPRESSED,
  MI_MATRIX,
  matrixDims,
  NUMERIC_DATA_TYPES,
} from "./mat-types.js";

/** One variable of a MAT-file, as found; only real numeric and logical arrays carry their data. */
export interface MatVariable {
  name: string;
  /** MATLAB's class name ("double", "logical", "cell", …). */
  className: string;
  /** Dimensions as MATLAB shows them (column-major). */
  dims: number[];
  complex: boolean;
  /** Where the variable's data element starts in the file. */
  byteOffset: number;
  /** The data as an array in Fortran (column-major) order; set for real numeric and logical variables. */
  array?: NpyArray;
  /**
   * Why a real numeric variable's data was not unpacked: its declared size is over the limits. Reading it
   * raises this error; the other variables stay readable.
   */
  refused?: InputFileError;
}

const HEADER_BYTES = 128;
// Enough inflated bytes to hold a variable's flags, dimensions and name, read before its data is unpacked.
const MATRIX_HEADER_BYTES = 4096;
const DATA_TYPE_NAMES: Record<number, string> = { 14: "miMATRIX", 15: "miCOMPRESSED" };

/**
 * Parses a MATLAB Level 5 MAT-file (the format MATLAB writes with -v6 and -v7, and scipy.io.savemat),
 * following the MATLAB 7 MAT-File Format document: a 128-byte header, then data elements, each an
 * miMATRIX or an miCOMPRESSED (zlib) wrapper around one. `maxBytes` bounds the unpacked data as a whole.
 * A compressed variable's header is unpacked first: one whose declared size passes `maxBytes`, or whose
 * matrices pass `maxCells`, is listed with `refused` set and is never unpacked.
 */
export function parseMat(
  bytes: Uint8Array,
  file: string,
  maxBytes: number,
  maxCells: number = DEFAULT_MAX_CELLS,
): MatVariable[] {
  const fail = (problem: InputFileProblem, reason: string, byteOffset?: number): never => {
    throw new InputFileError(file, problem, reason, byteOffset === undefined ? {} : { byteOffset });
  };
  if (bytes.length === 0) fail("empty-file", "file is empty (0 bytes)");
  const text = new TextDecoder("latin1").decode(bytes.subarray(0, Math.min(116, bytes.length)));
  if (
    text.startsWith("MATLAB 7.3") ||
    (bytes.length >= 8 && bytes[1] === 0x48 && text.startsWith("\x89HDF"))
  ) {
    fail("unknown-format", "a MATLAB 7.3 MAT-file (HDF5) is not read; save it with save(..., '-v7')");
  }
  if (!text.startsWith("MATLAB")) {
    fail("unknown-format", 'not a Level 5 MAT-file: the header does not start with "MATLAB"', 0);
  }
  if (bytes.length < HEADER_BYTES) {
    fail("truncated", `file is truncated: ${bytes.length} bytes, inside the 128-byte header`, bytes.length);
  }
  // The endian indicator "IM" reads as "MI" written by a big-endian machine.
  const indicator = String.fromCharCode(bytes[126], bytes[127]);
  if (indicator !== "IM" && indicator !== "MI") {
    fail(
      "unknown-format",
      `not a Level 5 MAT-file: endian indicator is ${JSON.stringify(indicator)}, not "IM" or "MI"`,
      126,
    );
  }
  const littleEndian = indicator === "IM";
  const fileView = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const version = fileView.getUint16(124, littleEndian);
  if (version !== 0x0100) {
    fail("unknown-format", `MAT-file version 0x${version.toString(16)} is not Level 5 (0x0100)`, 124);
  }
  const variables: MatVariable[] = [];
  let unpacked = 0;
  let at = HEADER_BYTES;
  while (at < bytes.length) {
    const tag = readTag(fileView, at, littleEndian, file, 0);
    if (tag.type === MI_COMPRESSED) {
      const packed = bytes.subarray(tag.dataStart, tag.dataStart + tag.size);
      const head = inflateBounded(packed, file, at, MATRIX_HEADER_BYTES, false);
      const headView = new DataView(head.buffer, head.byteOffset, head.byteLength);
      const innerTag = readTag(headView, 0, littleEndian, file, at, "inside the compressed element", true);
      if (innerTag.type === MI_MATRIX) {
        const declared = innerTag.dataStart + innerTag.size;
        const header =
          innerTag.size > 0 ? readMatrixHeader(head, innerTag, littleEndian, file, at) : undefined;
        // Only real numeric variables are ever read: the others are listed from their header alone.
        const numeric = header && isNumericClass(header.classNumber) && !header.variable.complex;
        const refused =
          declared > maxBytes - unpacked
            ? new InputFileError(
                file,
                "too-large",
                `${header ? `variable "${header.variable.name}": ` : ""}a compressed variable unpacks to ${formatBytes(declared)}, more than the limit of ${formatBytes(maxBytes - unpacked)}; raise maxBytes if you have the memory`,
                { byteOffset: at },
              )
            : header && oversizedMatrix(header, maxCells, file, at);
        if (header && !numeric) {
          variables.push(header.variable);
        } else if (refused && header) {
          variables.push({ ...header.variable, refused });
        } else if (refused) {
          throw refused;
        } else {
          const inner =
            head.length < declared ? inflateBounded(packed, file, at, maxBytes - unpacked, true) : head;
          unpacked += inner.length;
          const innerView = new DataView(inner.buffer, inner.byteOffset, inner.byteLength);
          const whole = readTag(innerView, 0, littleEndian, file, at, "inside the compressed element");
          variables.push(readMatrix(inner, whole, littleEndian, file, at, false));
        }
      }
      // miCOMPRESSED data is not padded: the next element follows the compressed bytes directly.
      at = tag.dataStart + tag.size;
    } else {
      if (tag.type === MI_MATRIX) variables.push(readMatrix(bytes, tag, littleEndian, file, at, true));
      at = tag.next;
    }
  }
  return variables;
}

interface Tag {
  type: number;
  size: number;
  dataStart: number;
  /** Start of the next element: data padded to 8 bytes. */
  next: number;
}

/**
 * A data element's tag, long (8 bytes) or small (4 bytes, data in the next 4). A type that no MAT-file uses
 * means the bytes are not MAT-file data at all (damaged, or random bytes after a valid header). `partial`
 * accepts data that runs past the bytes at hand (a header read before its element is unpacked).
 */
function readTag(
  view: DataView,
  at: number,
  le: boolean,
  file: string,
  fileOffset: number,
  where = "",
  partial = false,
): Tag {
  const place = (offset: number) => (fileOffset === 0 ? { byteOffset: offset } : { byteOffset: fileOffset });
  const inside = where ? ` ${where}` : "";
  if (at + 8 > view.byteLength) {
    throw new InputFileError(
      file,
      "truncated",
      `file is truncated: a data element tag${inside} is cut short`,
      place(at),
    );
  }
  const first = view.getUint32(at, le);
  const small = first >>> 16 !== 0;
  const type = small ? first & 0xffff : first;
  if (!isMatDataType(type) || (small && first >>> 16 > 4)) {
    throw new InputFileError(
      file,
      "bad-header",
      `no MAT-file data element starts here${inside}: its tag (0x${first.toString(16).padStart(8, "0")}) names no MATLAB data type; the bytes are damaged or not MAT-file data`,
      place(at),
    );
  }
  if (small) return { type, size: first >>> 16, dataStart: at + 4, next: at + 8 };
  const size = view.getUint32(at + 4, le);
  const dataStart = at + 8;
  if (!partial && dataStart + size > view.byteLength) {
    const name = DATA_TYPE_NAMES[first] ?? `type ${first}`;
    throw new InputFileError(
      file,
      "truncated",
      `file is truncated: a ${name} element${inside} declares ${size} bytes but only ${view.byteLength - dataStart} follow`,
      place(at),
    );
  }
  return { type: first, size, dataStart, next: dataStart + Math.ceil(size / 8) * 8 };
}

/**
 * An miMATRIX element's class, dimensions and name, from bytes that need not hold its data; undefined when
 * they do not reach that far (a name or dimension list longer than MATRIX_HEADER_BYTES).
 */
function readMatrixHeader(
  bytes: Uint8Array,
  tag: Tag,
  le: boolean,
  file: string,
  elementOffset: number,
): MatrixFields | undefined {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  try {
    return matrixFields(view, bytes, tag, le, file, elementOffset, (at) =>
      readTag(view, at, le, file, elementOffset, "inside the compressed element"),
    );
  } catch (error) {
    if (error instanceof InputFileError && error.problem === "truncated") return undefined;
    throw error;
  }
}

interface MatrixFields {
  variable: MatVariable;
  classNumber: number;
  logical: boolean;
  /** Where the sub-element after the name (the real part's data) starts. */
  next: number;
}

/** An miMATRIX element's array flags, dimensions and name: all that comes before its data. */
function matrixFields(
  view: DataView,
  bytes: Uint8Array,
  tag: Tag,
  le: boolean,
  file: string,
  elementOffset: number,
  sub: (at: number) => Tag,
): MatrixFields {
  const flagsTag = sub(tag.dataStart);
  if (flagsTag.size < 8) {
    throw new InputFileError(file, "bad-header", "array flags sub-element is shorter than 8 bytes", {
      byteOffset: elementOffset,
    });
  }
  const flagWord = view.getUint32(flagsTag.dataStart, le);
  const classNumber = flagWord & 0xff;
  const flags = (flagWord >>> 8) & 0xff;
  const dimsTag = sub(flagsTag.next);
  const dims: number[] = [];
  for (let k = 0; k < dimsTag.size / 4; k++) dims.push(view.getInt32(dimsTag.dataStart + 4 * k, le));
  const nameTag = sub(dimsTag.next);
  const name = new TextDecoder("latin1").decode(
    bytes.subarray(nameTag.dataStart, nameTag.dataStart + nameTag.size),
  );
  const logical = (flags & FLAG_LOGICAL) !== 0;
  const complex = (flags & FLAG_COMPLEX) !== 0;
  const className = logical ? "logical" : (ARRAY_CLASSES[classNumber] ?? `class ${classNumber}`);
  const variable: MatVariable = { name, className, dims, complex, byteOffset: elementOffset };
  return { variable, classNumber, logical, next: nameTag.next };
}

/** The refusal of a real numeric variable whose matrices have more cells than `maxCells`, if it is one. */
function oversizedMatrix(
  header: MatrixFields,
  maxCells: number,
  file: string,
  elementOffset: number,
): InputFileError | undefined {
  const { variable, classNumber } = header;
  if (!isNumericClass(classNumber) || variable.complex || variable.dims.some((d) => d < 0)) return undefined;
  const matrix = matrixDims(variable.dims);
  const problem = matrix && matrixSizeProblem(matrix[0], matrix[1], maxCells);
  return problem
    ? new InputFileError(file, "too-large", `variable "${variable.name}": ${problem}`, {
        byteOffset: elementOffset,
      })
    : undefined;
}

/** Reads an miMATRIX element's flags, dimensions, name and, for real numeric classes, its data. */
function readMatrix(
  bytes: Uint8Array,
  tag: Tag,
  le: boolean,
  file: string,
  elementOffset: number,
  inFile: boolean,
): MatVariable {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const sub = (at: number) =>
    readTag(view, at, le, file, inFile ? 0 : elementOffset, inFile ? "" : "inside the compressed element");
  const end = tag.dataStart + tag.size;
  const bad = (reason: string): never => {
    throw new InputFileError(file, "bad-header", reason, { byteOffset: elementOffset });
  };
  if (tag.size === 0)
    return { name: "", className: "empty", dims: [0, 0], complex: false, byteOffset: elementOffset };
  const fields = matrixFields(view, bytes, tag, le, file, elementOffset, sub);
  const { variable, classNumber, logical } = fields;
  const { name, dims, complex } = variable;
  if (!isNumericClass(classNumber) || complex) return variable;
  if (dims.some((d) => d < 0)) bad(`variable "${name}" has a negative dimension (${dims.join("×")})`);
  const dataTag = sub(fields.next);
  if (dataTag.dataStart + dataTag.size > end)
    bad(`variable "${name}": its data runs past the end of its element`);
  const type = NUMERIC_DATA_TYPES[dataTag.type];
  if (!type) bad(`variable "${name}": data of element type ${dataTag.type} is not numeric`);
  const count = dims.reduce((a, b) => a * b, 1);
  if (dataTag.size !== count * type.size) {
    throw new InputFileError(
      file,
      "truncated",
      `variable "${name}": ${dims.join("×")} elements of ${type.size} bytes need ${count * type.size} bytes, the element holds ${dataTag.size}`,
      { byteOffset: elementOffset },
    );
  }
  const kind = logical ? "b" : type.kind;
  const descr = `${type.size === 1 ? "|" : le ? "<" : ">"}${kind}${type.size}`;
  variable.array = {
    version: "MAT 5",
    dtype: { kind, size: type.size, littleEndian: le, descr },
    fortranOrder: true,
    shape: dims,
    dataOffset: dataTag.dataStart,
    bytes,
    trailingBytes: 0,
  };
  return variable;
}

// Inflates in slices. Whole: refused as soon as it passes `limit`, so a small file declaring a huge
// variable stops at the limit, not at the machine's memory. Not whole: the first `limit` bytes only.
function inflateBounded(
  data: Uint8Array,
  file: string,
  elementOffset: number,
  limit: number,
  whole: boolean,
): Uint8Array {
  const chunks: Uint8Array[] = [];
  let total = 0;
  const tooLarge = new InputFileError(
    file,
    "too-large",
    `a compressed variable unpacks to more than the limit of ${formatBytes(limit)}; raise maxBytes if you have the memory`,
    { byteOffset: elementOffset },
  );
  const stream = new Unzlib((chunk) => {
    total += chunk.length;
    if (whole && total > limit) throw tooLarge;
    chunks.push(chunk);
  });
  // A kilobyte of deflate unpacks to at most about a megabyte: small steps while only a header is wanted.
  const step = whole ? 1 << 16 : 1 << 10;
  try {
    for (let k = 0; k < data.length && (whole || total < limit); k += step)
      stream.push(data.subarray(k, k + step), k + step >= data.length);
    if (data.length === 0) stream.push(data, true);
  } catch (error) {
    if (error === tooLarge) throw error;
    throw new InputFileError(
      file,
      "truncated",
      `a compressed element cannot be unpacked (${(error as Error).message}); the file is truncated or damaged`,
      { byteOffset: elementOffset },
    );
  }
  const length = whole ? total : Math.min(total, limit);
  if (chunks.length === 1 && chunks[0].length === length) return chunks[0];
  const out = new Uint8Array(length);
  let offset = 0;
  for (const chunk of chunks) {
    if (offset >= length) break;
    const piece = chunk.subarray(0, length - offset);
    out.set(piece, offset);
    offset += piece.length;
  }
  return out;
}

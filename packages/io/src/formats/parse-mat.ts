import { Unzlib } from "fflate";
import { InputFileError, type InputFileProblem } from "../input-file-error.js";
import type { NpyArray } from "../parse-npy.js";
import { formatBytes } from "../read-options.js";
import {
  ARRAY_CLASSES,
  FLAG_COMPLEX,
  FLAG_LOGICAL,
  isNumericClass,
  MI_COMPRESSED,
  MI_MATRIX,
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
}

const HEADER_BYTES = 128;
const DATA_TYPE_NAMES: Record<number, string> = { 14: "miMATRIX", 15: "miCOMPRESSED" };

/**
 * Parses a MATLAB Level 5 MAT-file (the format MATLAB writes with -v6 and -v7, and scipy.io.savemat),
 * following the MATLAB 7 MAT-File Format document: a 128-byte header, then data elements, each an
 * miMATRIX or an miCOMPRESSED (zlib) wrapper around one. `maxBytes` bounds the unpacked data as a whole.
 */
export function parseMat(bytes: Uint8Array, file: string, maxBytes: number): MatVariable[] {
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
      const inner = inflateBounded(
        bytes.subarray(tag.dataStart, tag.dataStart + tag.size),
        file,
        at,
        maxBytes - unpacked,
      );
      unpacked += inner.length;
      const innerView = new DataView(inner.buffer, inner.byteOffset, inner.byteLength);
      const innerTag = readTag(innerView, 0, littleEndian, file, at, "inside the compressed element");
      if (innerTag.type === MI_MATRIX)
        variables.push(readMatrix(inner, innerTag, littleEndian, file, at, false));
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

/** A data element's tag, long (8 bytes) or small (4 bytes, data in the next 4). */
function readTag(view: DataView, at: number, le: boolean, file: string, fileOffset: number, where = ""): Tag {
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
  if (first >>> 16 !== 0) {
    return { type: first & 0xffff, size: first >>> 16, dataStart: at + 4, next: at + 8 };
  }
  const size = view.getUint32(at + 4, le);
  const dataStart = at + 8;
  if (dataStart + size > view.byteLength) {
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
  const flagsTag = sub(tag.dataStart);
  if (flagsTag.size < 8) bad("array flags sub-element is shorter than 8 bytes");
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
  if (!isNumericClass(classNumber) || complex) return variable;
  if (dims.some((d) => d < 0)) bad(`variable "${name}" has a negative dimension (${dims.join("×")})`);
  const dataTag = sub(nameTag.next);
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

// Inflates in slices so that a small file declaring a huge variable stops at the limit, not at the
// machine's memory.
function inflateBounded(data: Uint8Array, file: string, elementOffset: number, limit: number): Uint8Array {
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
    if (total > limit) throw tooLarge;
    chunks.push(chunk);
  });
  const step = 1 << 16;
  try {
    for (let k = 0; k < data.length; k += step)
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
  if (chunks.length === 1) return chunks[0];
  const out = new Uint8Array(total);
  let offset = 0;
  for (const chunk of chunks) {
    out.set(chunk, offset);
    offset += chunk.length;
  }
  return out;
}

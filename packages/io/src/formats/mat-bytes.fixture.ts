// Level 5 MAT-file bytes built by hand from the MATLAB 7 MAT-File Format document (MathWorks): a 128-byte
// header (text, subsystem offset, version 0x0100 at byte 124, endian indicator "IM" at 126), then data
// elements: an 8-byte tag (type, byte count) and data padded to 8 bytes; miMATRIX (14) holds array flags,
// dimensions, name and real part; miCOMPRESSED (15) holds one zlib-compressed element, unpadded.
import { zlibSync } from "fflate";
import { errorOf as sharedErrorOf } from "../../../../test/support/error-of.js";
import { InputFileError } from "../input-file-error.js";

export function concat(...parts: Uint8Array[]): Uint8Array {
  const out = new Uint8Array(parts.reduce((a, p) => a + p.length, 0));
  let at = 0;
  for (const p of parts) {
    out.set(p, at);
    at += p.length;
  }
  return out;
}

/** The InputFileError that `read` throws (the shared errorOf, for this one class). */
export const errorOf = (read: () => unknown): InputFileError => sharedErrorOf(read, InputFileError);

/** The 128-byte header; `indicator` and `version` can be set to wrong values. */
export function matHeader(littleEndian = true, indicator?: string, version = 0x0100): Uint8Array {
  const header = new Uint8Array(128).fill(0x20);
  const text = "MATLAB 5.0 MAT-file, built by a test";
  for (let k = 0; k < text.length; k++) header[k] = text.charCodeAt(k);
  new DataView(header.buffer).setUint16(124, version, littleEndian);
  // "IM" as written by the machine's byte order: read back as "MI" on a big-endian one.
  const mark = indicator ?? (littleEndian ? "IM" : "MI");
  header.set([mark.charCodeAt(0), mark.charCodeAt(1)], 126);
  return header;
}

/** A data element with a long (8-byte) tag; `declared` overrides the byte count the tag states. */
export function element(type: number, data: Uint8Array, le = true, declared = data.length): Uint8Array {
  const out = new Uint8Array(8 + Math.ceil(data.length / 8) * 8);
  const view = new DataView(out.buffer);
  view.setUint32(0, type, le);
  view.setUint32(4, declared, le);
  out.set(data, 8);
  return out;
}

/** Array flags (class number in the low byte, flags in the next) as an miUINT32 (6) sub-element. */
export function flagsElement(classNumber: number, flags = 0, le = true): Uint8Array {
  const data = new Uint8Array(8);
  new DataView(data.buffer).setUint32(0, classNumber | (flags << 8), le);
  return element(6, data, le);
}

/** Dimensions as an miINT32 (5) sub-element. */
export function dimsElement(dims: number[], le = true): Uint8Array {
  const data = new Uint8Array(4 * dims.length);
  const view = new DataView(data.buffer);
  for (const [k, d] of dims.entries()) view.setInt32(4 * k, d, le);
  return element(5, data, le);
}

/** The name as an miINT8 (1) sub-element. */
export function nameElement(name: string, le = true): Uint8Array {
  return element(1, new TextEncoder().encode(name), le);
}

/** Float64 values as an miDOUBLE (9) sub-element. */
export function doublesElement(values: number[], le = true): Uint8Array {
  const data = new Uint8Array(8 * values.length);
  const view = new DataView(data.buffer);
  for (const [k, v] of values.entries()) view.setFloat64(8 * k, v, le);
  return element(9, data, le);
}

/** An miMATRIX element around the given sub-elements; `declared` overrides its byte count. */
export function miMatrix(parts: Uint8Array[], le = true, declared?: number): Uint8Array {
  const body = concat(...parts);
  return element(14, body, le, declared ?? body.length);
}

/** A real double matrix rows × cols, values in column-major order, as MATLAB writes it. */
export function matrixElement(
  name: string,
  rows: number,
  cols: number,
  values: number[],
  le: boolean,
  storage: "miDOUBLE" | "miUINT8" = "miDOUBLE",
): Uint8Array {
  // MATLAB may store a double array's values in a smaller type when they fit (format document, "Numeric
  // Arrays"): the class stays double.
  const data = storage === "miDOUBLE" ? doublesElement(values, le) : element(2, new Uint8Array(values), le);
  return miMatrix([flagsElement(6, 0, le), dimsElement([rows, cols], le), nameElement(name, le), data], le);
}

/** An miCOMPRESSED element: `stream` (a zlib stream, by default `inner` compressed by fflate). */
export function compressedElement(inner: Uint8Array, le = true, stream = zlibSync(inner)): Uint8Array {
  const tag = new Uint8Array(8);
  new DataView(tag.buffer).setUint32(0, 15, le);
  new DataView(tag.buffer).setUint32(4, stream.length, le);
  return concat(tag, stream);
}

/** A Level 5 MAT-file with one double matrix, column-major, in either byte order, optionally compressed. */
export function matFile(
  name: string,
  rows: number,
  cols: number,
  values: number[],
  littleEndian: boolean,
  compress: boolean,
): Uint8Array {
  const inner = matrixElement(name, rows, cols, values, littleEndian);
  return concat(matHeader(littleEndian), compress ? compressedElement(inner, littleEndian) : inner);
}

/**
 * A zlib stream (RFC 1950) of `data` in stored deflate blocks (RFC 1951 §3.2.4: a header byte with BFINAL and
 * BTYPE 00, LEN and its complement NLEN, the bytes as they are), split at `cuts`; its length is exactly
 * 2 + 5 × blocks + data.length + 4, which a compressor does not promise. Worked by hand from the RFCs.
 */
export function storedZlib(data: Uint8Array, cuts: number[] = []): Uint8Array {
  const bounds = [0, ...cuts, data.length];
  const parts: Uint8Array[] = [new Uint8Array([0x78, 0x01])]; // CM 8, CINFO 7, FCHECK: 0x7801 % 31 === 0
  for (let b = 0; b + 1 < bounds.length; b++) {
    const piece = data.subarray(bounds[b], bounds[b + 1]);
    const head = new Uint8Array(5);
    head[0] = b + 2 === bounds.length ? 1 : 0;
    new DataView(head.buffer).setUint16(1, piece.length, true);
    new DataView(head.buffer).setUint16(3, ~piece.length & 0xffff, true);
    parts.push(head, piece);
  }
  // Adler-32 (RFC 1950 §8.2), big-endian.
  let a = 1;
  let s = 0;
  for (const byte of data) {
    a = (a + byte) % 65521;
    s = (s + a) % 65521;
  }
  const sum = new Uint8Array(4);
  new DataView(sum.buffer).setUint32(0, ((s << 16) | a) >>> 0, false);
  parts.push(sum);
  return concat(...parts);
}

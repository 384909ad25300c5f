/** Element types the writer produces. */
export type NpyWriteDtype = "float64" | "float32" | "int64";

const DESCR: Record<NpyWriteDtype, string> = { float64: "<f8", float32: "<f4", int64: "<i8" };
const SIZE: Record<NpyWriteDtype, number> = { float64: 8, float32: 4, int64: 8 };

/**
 * Encodes an array as a .npy file: little-endian, C order, format version 1.0 (2.0 when the header is
 * too long for 1.0's 16-bit length). `values` are in C (row-major) order. The header is padded with
 * spaces and ends in a newline so that the data starts on a multiple of 64 bytes, as numpy's own writer
 * does (NumPy format documentation; NEP 1 asked for 16, recalled from memory).
 */
export function encodeNpy(
  values: ArrayLike<number>,
  shape: readonly number[],
  dtype: NpyWriteDtype = "float64",
): Uint8Array {
  for (const d of shape) {
    if (!Number.isSafeInteger(d) || d < 0)
      throw new RangeError(`shape entry ${d} is not a non-negative integer`);
  }
  const count = shape.reduce((a, b) => a * b, 1);
  if (values.length !== count) {
    throw new RangeError(`shape (${shape.join(", ")}) needs ${count} values, got ${values.length}`);
  }
  // Python's repr of a tuple: a 1-tuple keeps its trailing comma.
  const shapeText = shape.length === 1 ? `(${shape[0]},)` : `(${shape.join(", ")})`;
  const dict = `{'descr': '${DESCR[dtype]}', 'fortran_order': False, 'shape': ${shapeText}, }`;
  let lengthBytes = 2;
  let major = 1;
  let total = 8 + lengthBytes + dict.length + 1;
  if (Math.ceil(total / 64) * 64 - 8 - lengthBytes > 0xffff) {
    lengthBytes = 4;
    major = 2;
    total = 8 + lengthBytes + dict.length + 1;
  }
  const dataOffset = Math.ceil(total / 64) * 64;
  const header = `${dict}${" ".repeat(dataOffset - total)}\n`;
  const out = new Uint8Array(dataOffset + count * SIZE[dtype]);
  const view = new DataView(out.buffer);
  out.set([0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59, major, 0]);
  if (major === 1) view.setUint16(8, header.length, true);
  else view.setUint32(8, header.length, true);
  for (let k = 0; k < header.length; k++) out[8 + lengthBytes + k] = header.charCodeAt(k);
  for (let k = 0; k < count; k++) {
    const at = dataOffset + k * SIZE[dtype];
    const v = values[k];
    if (dtype === "float64") view.setFloat64(at, v, true);
    else if (dtype === "float32") view.setFloat32(at, v, true);
    else {
      if (!Number.isSafeInteger(v))
        throw new RangeError(`value ${v} at position ${k} is not an exact integer`);
      view.setBigInt64(at, BigInt(v), true);
    }
  }
  return out;
}

/**
 * The bytes of a .npy header (NumPy format specification, NEP 1): magic "\x93NUMPY", version, header
 * length, then a Python dict literal padded with spaces and a newline so the data starts on a multiple
 * of 64 bytes, as numpy's own writer pads. Version 1.0 unless the header needs 2.0's 32-bit length.
 * `minDataOffset` (a multiple of 64) pads it further, so a header rewritten with a smaller shape keeps
 * the data where it is.
 */
export function npyHeader(descr: string, shape: readonly number[], minDataOffset = 0): Uint8Array {
  for (const d of shape) {
    if (!Number.isSafeInteger(d) || d < 0)
      throw new RangeError(`shape entry ${d} is not a non-negative integer`);
  }
  // Python's repr of a tuple: a 1-tuple keeps its trailing comma.
  const shapeText = shape.length === 1 ? `(${shape[0]},)` : `(${shape.join(", ")})`;
  const dict = `{'descr': '${descr}', 'fortran_order': False, 'shape': ${shapeText}, }`;
  let lengthBytes = 2;
  let total = 8 + lengthBytes + dict.length + 1;
  if (Math.ceil(total / 64) * 64 - 10 > 0xffff) {
    lengthBytes = 4;
    total = 8 + lengthBytes + dict.length + 1;
  }
  const dataOffset = Math.max(Math.ceil(total / 64) * 64, minDataOffset);
  const text = `${dict}${" ".repeat(dataOffset - total)}\n`;
  const out = new Uint8Array(dataOffset);
  const view = new DataView(out.buffer);
  out.set([0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59, lengthBytes === 2 ? 1 : 2, 0]);
  if (lengthBytes === 2) view.setUint16(8, text.length, true);
  else view.setUint32(8, text.length, true);
  for (let k = 0; k < text.length; k++) out[8 + lengthBytes + k] = text.charCodeAt(k);
  return out;
}

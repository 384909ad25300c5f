import { npyHeader } from "./npy-header.js";

/**
 * A .npy file of 64-bit integers from a BigInt64Array (every value exact, even beyond 2^53), C order.
 */
export function encodeNpyBigInt64(values: BigInt64Array, shape: readonly number[]): Uint8Array {
  checkCount(values.length, shape);
  const header = npyHeader("<i8", shape);
  const out = new Uint8Array(header.length + values.length * 8);
  out.set(header);
  const view = new DataView(out.buffer);
  for (let k = 0; k < values.length; k++) view.setBigInt64(header.length + k * 8, values[k], true);
  return out;
}

/**
 * A .npy file of fixed-width unicode strings (dtype "<U{width}", width = the longest string in code
 * points, at least 1), stored as little-endian UTF-32 padded with zeros: numpy loads these without pickle,
 * unlike arrays of Python objects. Strings may not contain U+0000, which numpy would read as padding.
 */
export function encodeNpyStrings(
  values: readonly string[],
  shape: readonly number[] = [values.length],
): Uint8Array {
  checkCount(values.length, shape);
  // Two passes over the strings and no per-string arrays: a million ids cost no more than their text.
  let width = 1;
  for (let k = 0; k < values.length; k++) {
    let points = 0;
    for (const ch of values[k]) {
      if (ch === "\u0000") throw new RangeError(`string ${k} contains U+0000, which numpy reads as padding`);
      points++;
    }
    if (points > width) width = points;
  }
  const header = npyHeader(`<U${width}`, shape);
  const out = new Uint8Array(header.length + values.length * width * 4);
  out.set(header);
  const view = new DataView(out.buffer);
  for (let k = 0; k < values.length; k++) {
    let at = header.length + k * width * 4;
    for (const ch of values[k]) {
      view.setUint32(at, ch.codePointAt(0) as number, true);
      at += 4;
    }
  }
  return out;
}

function checkCount(count: number, shape: readonly number[]): void {
  const needed = shape.reduce((a, b) => a * b, 1);
  if (needed !== count)
    throw new RangeError(`shape (${shape.join(", ")}) needs ${needed} values, got ${count}`);
}

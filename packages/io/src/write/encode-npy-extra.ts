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
  const codePoints = values.map((text, k) => {
    const points = Array.from(text, (ch) => ch.codePointAt(0) as number);
    if (points.includes(0)) throw new RangeError(`string ${k} contains U+0000, which numpy reads as padding`);
    return points;
  });
  const width = Math.max(1, ...codePoints.map((points) => points.length));
  const header = npyHeader(`<U${width}`, shape);
  const out = new Uint8Array(header.length + values.length * width * 4);
  out.set(header);
  const view = new DataView(out.buffer);
  codePoints.forEach((points, k) => {
    points.forEach((point, c) => {
      view.setUint32(header.length + (k * width + c) * 4, point, true);
    });
  });
  return out;
}

function checkCount(count: number, shape: readonly number[]): void {
  const needed = shape.reduce((a, b) => a * b, 1);
  if (needed !== count)
    throw new RangeError(`shape (${shape.join(", ")}) needs ${needed} values, got ${count}`);
}

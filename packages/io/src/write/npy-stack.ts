import { npyHeader } from "./npy-header.js";

/** A float64 .npy stack filled item by item, in any order, inside one buffer. */
export interface NpyStack {
  /** Copies one item (`itemShape` values in C order) into slot `slot` (0 ≤ slot < capacity). */
  put(slot: number, values: Float64Array): void;
  /**
   * The .npy bytes of the stack made of `slots` (ascending), in that order: shape (slots.length,
   * ...itemShape). Moves the items to the front of the buffer: call once, at the end.
   */
  finish(slots: readonly number[]): Uint8Array;
}

/**
 * One buffer for a whole (k, ...itemShape) float64 stack, allocated once: results that arrive out of order
 * go straight to their slot, and slots left empty (failed items) are squeezed out at the end, without a
 * second copy of the stack in memory. The bytes equal numpy.save's for the same array (little-endian, C
 * order; the header is padded as for `capacity` items, which numpy reads alike). Values are stored in
 * the machine's byte order through a Float64Array: little-endian on every platform Node runs on.
 */
export function createNpyStack(itemShape: readonly number[], capacity: number): NpyStack {
  const itemLength = itemShape.reduce((a, b) => a * b, 1);
  const itemBytes = itemLength * 8;
  const dataOffset = npyHeader("<f8", [capacity, ...itemShape]).length;
  const buffer = new Uint8Array(dataOffset + capacity * itemBytes);
  const data = new Float64Array(buffer.buffer, dataOffset, capacity * itemLength);
  return {
    put(slot, values) {
      if (values.length !== itemLength) {
        throw new RangeError(`item of ${values.length} values; the stack holds items of ${itemLength}`);
      }
      data.set(values, slot * itemLength);
    },
    finish(slots) {
      slots.forEach((slot, k) => {
        if (slot !== k) data.copyWithin(k * itemLength, slot * itemLength, (slot + 1) * itemLength);
      });
      buffer.set(npyHeader("<f8", [slots.length, ...itemShape], dataOffset));
      return buffer.subarray(0, dataOffset + slots.length * itemBytes);
    },
  };
}

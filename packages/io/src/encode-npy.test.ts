import { describe, expect, it } from "vitest";
import { encodeNpy } from "./encode-npy.js";
import { npyValues, parseNpy } from "./parse-npy.js";

describe("encodeNpy", () => {
  it("aligns the data to 64 bytes and ends the header with a newline (NumPy format documentation)", () => {
    for (const shape of [[0], [3], [2, 2], [10, 20, 30]]) {
      const bytes = encodeNpy(new Float64Array(shape.reduce((a, b) => a * b, 1)), shape);
      const headerLength = bytes[8] | (bytes[9] << 8);
      expect((10 + headerLength) % 64).toBe(0);
      expect(bytes[10 + headerLength - 1]).toBe(0x0a);
    }
  });

  it("switches to version 2.0 when the header outgrows 16 bits, and reads back", () => {
    // 22000 axes of length 1: "1, " per axis makes a header of about 66 000 bytes.
    const shape = new Array<number>(22000).fill(1);
    const array = parseNpy(encodeNpy([42], shape), "v2.npy");
    expect(array.version).toBe("2.0");
    expect(array.dataOffset % 64).toBe(0);
    expect(Array.from(npyValues(array))).toEqual([42]);
  });

  it("round-trips float32 to the nearest float32 and int64 exactly", () => {
    const f32 = parseNpy(encodeNpy([0.1, 1 / 3], [2], "float32"), "x");
    expect(Array.from(npyValues(f32))).toEqual([Math.fround(0.1), Math.fround(1 / 3)]);
    const i64 = parseNpy(encodeNpy([2 ** 53 - 1, -(2 ** 53) + 1], [2], "int64"), "x");
    expect(Array.from(npyValues(i64))).toEqual([2 ** 53 - 1, -(2 ** 53) + 1]);
  });

  it("refuses values that do not fit the shape or the dtype", () => {
    expect(() => encodeNpy([1, 2, 3], [2, 2])).toThrow("shape (2, 2) needs 4 values, got 3");
    expect(() => encodeNpy([0.5], [1], "int64")).toThrow("value 0.5 at position 0 is not an exact integer");
    expect(() => encodeNpy([], [-1])).toThrow("shape entry -1 is not a non-negative integer");
  });
});

import { describe, expect, it } from "vitest";
import { encodeNpy } from "../encode-npy.js";
import { parseNpy } from "../parse-npy.js";
import { createNpyStack } from "./npy-stack.js";

describe("createNpyStack", () => {
  it("items put out of order, empty slots squeezed out: the bytes encodeNpy writes for the kept items", () => {
    const stack = createNpyStack([2, 2], 5);
    const item = (k: number) => Float64Array.from([k, k + 0.5, -k, 1 / (k + 1)]);
    for (const k of [4, 0, 2]) stack.put(k, item(k));
    const bytes = stack.finish([0, 2, 4]);
    const expected = encodeNpy([...item(0), ...item(2), ...item(4)], [3, 2, 2]);
    expect(Buffer.from(bytes).equals(Buffer.from(expected))).toBe(true);
  });

  it("a header padded for a longer shape still reads as the shorter one", () => {
    const stack = createNpyStack([3], 100000);
    stack.put(7, Float64Array.from([1, 2, 3]));
    const array = parseNpy(stack.finish([7]), "s.npy");
    expect([array.shape, array.dataOffset % 64, array.trailingBytes]).toEqual([[1, 3], 0, 0]);
    expect(() => stack.put(0, new Float64Array(2))).toThrow(/item of 2 values/);
  });
});

import { describe, expect, it } from "vitest";
import { encodeNpyStrings } from "./encode-npy-extra.js";

describe("encodeNpyStrings", () => {
  it("encodes a million ids without a call whose argument count grows with them", () => {
    // 130,000 ids once overflowed the call stack (a spread into Math.max); a million must pass.
    const ids = Array.from({ length: 1_000_000 }, (_, k) => `g-${k}`);
    ids[123_456] = "🧠-longest-id";
    const bytes = encodeNpyStrings(ids);
    const view = new DataView(bytes.buffer, bytes.byteOffset);
    const dataOffset = 10 + view.getUint16(8, true);
    const header = new TextDecoder("latin1").decode(bytes.subarray(10, dataOffset));
    // NumPy's fixed-width unicode: the longest string in code points ("🧠" is one) sets the width.
    expect(header).toMatch(/^\{'descr': '<U12', 'fortran_order': False, 'shape': \(1000000,\), \} *\n$/);
    expect(bytes.length).toBe(dataOffset + 1_000_000 * 12 * 4);
    const at = (k: number, c: number) => view.getUint32(dataOffset + (k * 12 + c) * 4, true);
    expect(at(123_456, 0)).toBe(0x1f9e0);
    expect(String.fromCodePoint(at(999_999, 0), at(999_999, 1), at(999_999, 2))).toBe("g-9");
    expect(at(999_999, 8)).toBe(0); // padding after "g-999999"
  });

  it("refuses U+0000, which numpy reads as padding", () => {
    expect(() => encodeNpyStrings(["ok", "a\u0000b"])).toThrow("string 1 contains U+0000");
  });
});

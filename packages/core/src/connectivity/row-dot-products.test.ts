import { describe, expect, it } from "vitest";
import { normals } from "./connectivity.fixture.js";
import { rowCrossProducts, rowGram } from "./row-dot-products.js";

/** The definition, one dot product at a time, summed in time order like the blocked kernels. */
function naive(a: Float64Array, b: Float64Array, rows: number, length: number): Float64Array {
  const out = new Float64Array(rows * rows);
  for (let i = 0; i < rows; i++) {
    for (let j = 0; j < rows; j++) {
      let s = 0;
      for (let t = 0; t < length; t++) s += a[i * length + t] * b[j * length + t];
      out[i * rows + j] = s;
    }
  }
  return out;
}

describe("row dot products", () => {
  it("equal the definition bit for bit, for every remainder of the 2 × 4 blocks", () => {
    for (const rows of [1, 2, 3, 4, 5, 6, 7, 9, 10, 13]) {
      const next = normals(rows);
      const a = Float64Array.from({ length: rows * 17 }, next);
      const b = Float64Array.from({ length: rows * 17 }, next);
      expect(Array.from(rowGram(a, rows, 17, new Float64Array(rows * rows)))).toEqual(
        Array.from(naive(a, a, rows, 17)),
      );
      expect(Array.from(rowCrossProducts(a, b, rows, 17, new Float64Array(rows * rows)))).toEqual(
        Array.from(naive(a, b, rows, 17)),
      );
    }
  });
});

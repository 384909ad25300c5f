import { describe, expect, it } from "vitest";
import { normals } from "./connectivity.fixture.js";
import { invertPositiveDefinite } from "./invert-positive-definite.js";

describe("invertPositiveDefinite", () => {
  it("A · A⁻¹ = I for a random positive-definite A = BᵀB + I (definition of the inverse)", () => {
    const n = 37;
    const next = normals(5);
    const B = Float64Array.from({ length: n * n }, next);
    const A = new Float64Array(n * n);
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        let s = i === j ? 1 : 0;
        for (let k = 0; k < n; k++) s += B[k * n + i] * B[k * n + j];
        A[i * n + j] = s;
      }
    }
    const inverse = invertPositiveDefinite(A, n)!;
    let worst = 0;
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        let s = 0;
        for (let k = 0; k < n; k++) s += A[i * n + k] * inverse[k * n + j];
        worst = Math.max(worst, Math.abs(s - (i === j ? 1 : 0)));
      }
      for (let j = 0; j < n; j++) expect(inverse[i * n + j]).toBe(inverse[j * n + i]);
    }
    expect(worst).toBeLessThan(1e-9);
  });

  it("the 2 × 2 closed form [[a, b], [b, d]]⁻¹ = [[d, −b], [−b, a]] / (ad − b²)", () => {
    const inverse = invertPositiveDefinite(Float64Array.from([4, 1, 1, 3]), 2)!;
    expect(Array.from(inverse).map((x) => x * 11)).toEqual([3, -1, -1, 4].map((x) => expect.closeTo(x, 12)));
  });

  it("returns null for a singular or indefinite matrix", () => {
    expect(invertPositiveDefinite(Float64Array.from([1, 1, 1, 1]), 2)).toBeNull();
    expect(invertPositiveDefinite(Float64Array.from([1, 2, 2, 1]), 2)).toBeNull();
  });
});

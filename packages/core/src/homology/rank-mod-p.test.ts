import { describe, expect, it } from "vitest";
import { primeField } from "./prime-field.js";
import { rankModP } from "./rank-mod-p.js";

/** Columns given densely (array of columns, each an array over rows). */
function rankOf(columns: number[][], p: number): number {
  const start = [0];
  const rows: number[] = [];
  const coefs: number[] = [];
  for (const col of columns) {
    col.forEach((x, r) => {
      if (x !== 0) {
        rows.push(r);
        coefs.push(x);
      }
    });
    start.push(rows.length);
  }
  return rankModP(
    Int32Array.from(start),
    Int32Array.from(rows),
    Int32Array.from(coefs),
    columns[0]?.length ?? 0,
    primeField(p),
  );
}

describe("rankModP", () => {
  it("depends on the characteristic like linear algebra says (hand-checked determinants, common practice)", () => {
    // det [[1,1],[1,-1]] = -2: rank 2 over Z/3, rank 1 over Z/2.
    expect(
      rankOf(
        [
          [1, 1],
          [1, -1],
        ],
        3,
      ),
    ).toBe(2);
    expect(
      rankOf(
        [
          [1, 1],
          [1, -1],
        ],
        2,
      ),
    ).toBe(1);
    // Columns e1+e2, e2+e3, e1+e3: det 2.
    expect(
      rankOf(
        [
          [1, 1, 0],
          [0, 1, 1],
          [1, 0, 1],
        ],
        2,
      ),
    ).toBe(2);
    expect(
      rankOf(
        [
          [1, 1, 0],
          [0, 1, 1],
          [1, 0, 1],
        ],
        5,
      ),
    ).toBe(3);
    expect(rankOf([[0, 0, 0]], 2)).toBe(0);
  });

  it("divides by pivots other than ±1 (hand-checked determinants, common practice)", () => {
    // Columns (1, 2) and (3, 1): det = 1·1 − 3·2 = −5. The first column's pivot (its largest row) has the
    // coefficient 2, so cancelling it needs 2⁻¹ (3 mod 5, 4 mod 7), not 2.
    const columns = [
      [1, 2],
      [3, 1],
    ];
    expect(rankOf(columns, 5)).toBe(1);
    expect(rankOf(columns, 7)).toBe(2);
    // Columns (0, 3, 4), (1, 2, 0), (2, 0, 6): det = 0·(2·6 − 0·0) − 1·(3·6 − 0·4) + 2·(3·0 − 2·4) = −34
    // = −2·17 (by hand, first-row expansion): rank 2 over Z/2 and Z/17, rank 3 over Z/5 and Z/7.
    const bigger = [
      [0, 3, 4],
      [1, 2, 0],
      [2, 0, 6],
    ];
    expect(rankOf(bigger, 17)).toBe(2);
    expect(rankOf(bigger, 2)).toBe(2);
    expect(rankOf(bigger, 5)).toBe(3);
    expect(rankOf(bigger, 7)).toBe(3);
  });

  it("takes a column's rows in any order and repeated, summing repeats (hand-checked determinants)", () => {
    const rank = (start: number[], rows: number[], coefs: number[], rowCount: number, p: number) =>
      rankModP(
        Int32Array.from(start),
        Int32Array.from(rows),
        Int32Array.from(coefs),
        rowCount,
        primeField(p),
      );
    // Over Z/5, rows listed largest first: c0 = 2·e1 + 2·e1 = 4·e1, c1 = e1 + 2·e0, c2 = 2·e1 + e0 + e0.
    // det(c0, c1) = 0·1 − 2·4 = −8 ≡ 2 (mod 5): rank 2, and three columns in two rows cannot give more.
    expect(rank([0, 2, 4, 7], [1, 1, 1, 0, 1, 0, 0], [2, 2, 1, 2, 2, 1, 1], 2, 5)).toBe(2);
    // Over Z/2: c0 = (1 + 3 + 2)·e0 = 0, c1 = (1 + 3 + 1)·e0 = e0, c2 = 3·e0 + 3·e1 = e0 + e1, c3 = 3·e0 + 2·e1
    // = e0: rank 2 (c1 and c2 are independent).
    expect(rank([0, 3, 6, 8, 10], [0, 0, 0, 0, 0, 0, 0, 1, 0, 1], [1, 3, 2, 1, 3, 1, 3, 3, 3, 2], 2, 2)).toBe(
      2,
    );
  });
});

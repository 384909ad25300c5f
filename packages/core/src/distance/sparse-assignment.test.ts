import { describe, expect, it } from "vitest";
import { sparseAssignment } from "./sparse-assignment.js";

/** Compressed rows of a dense matrix in which Infinity marks a forbidden entry. */
function rowsOf(matrix: number[][]) {
  const offsets = [0];
  const targets: number[] = [];
  const costs: number[] = [];
  for (const row of matrix) {
    row.forEach((c, j) => {
      if (c !== Infinity) {
        targets.push(j);
        costs.push(c);
      }
    });
    offsets.push(targets.length);
  }
  return [Int32Array.from(offsets), Int32Array.from(targets), Float64Array.from(costs)] as const;
}

/** Every assignment of rows to distinct columns, by brute force (the definition). */
function bruteForce(matrix: number[][]): number {
  const columns = matrix[0].length;
  let best = Infinity;
  const used = new Array<boolean>(columns).fill(false);
  const walk = (row: number, sum: number) => {
    if (row === matrix.length) {
      best = Math.min(best, sum);
      return;
    }
    for (let j = 0; j < columns; j++) {
      if (used[j] || matrix[row][j] === Infinity) continue;
      used[j] = true;
      walk(row + 1, sum + matrix[row][j]);
      used[j] = false;
    }
  };
  walk(0, 0);
  return best;
}

describe("sparseAssignment", () => {
  it("finds the optimum of small square and rectangular matrices, negative and forbidden entries included", () => {
    let seed = 11;
    const random = () => {
      seed = (seed * 48271) % 2147483647;
      return seed / 2147483647;
    };
    for (let trial = 0; trial < 300; trial++) {
      const rows = 1 + Math.floor(random() * 5);
      const columns = rows + Math.floor(random() * 3);
      const matrix = Array.from({ length: rows }, (_, i) =>
        Array.from({ length: columns }, (_, j) =>
          j === i ? Math.floor(random() * 9) : random() < 0.3 ? Infinity : Math.floor(random() * 13) - 4,
        ),
      );
      const { columnOf, total } = sparseAssignment(rows, columns, ...rowsOf(matrix));
      expect(total).toBe(bruteForce(matrix));
      expect(new Set(columnOf).size).toBe(rows);
      expect(columnOf.reduce((s, j, i) => s + matrix[i][j], 0)).toBe(total);
    }
  });

  it("says which row cannot be assigned", () => {
    expect(() =>
      sparseAssignment(
        2,
        2,
        ...rowsOf([
          [1, Infinity],
          [2, Infinity],
        ]),
      ),
    ).toThrow(/row 1/);
  });
});

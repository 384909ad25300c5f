import { describe, expect, it } from "vitest";
import { VertexMemo } from "./vertex-memo.js";

describe("VertexMemo", () => {
  it("remembers a vertex's numbers while the band stays, and forgets every vertex on a new band", () => {
    const memo = new VertexMemo(5);
    memo.use(1, 2, 3);
    expect(memo.has(4)).toBe(false);
    memo.set(4, 7, 9);
    memo.use(1, 2, 3); // the same band again
    expect(memo.has(4)).toBe(true);
    expect([memo.first[4], memo.second[4]]).toEqual([7, 9]);
    for (const band of [
      [0, 2, 3],
      [1, 0, 3],
      [1, 2, Infinity],
    ]) {
      memo.use(1, 2, 3);
      memo.set(2, 1, 1);
      memo.use(band[0], band[1], band[2]);
      expect(memo.has(2), `band ${band}`).toBe(false);
    }
  });

  it("treats −∞ and +∞ bands like any other, and starts with nothing remembered", () => {
    const memo = new VertexMemo(3);
    memo.use(Number.NEGATIVE_INFINITY, Number.NEGATIVE_INFINITY, Number.POSITIVE_INFINITY);
    expect([memo.has(0), memo.has(1), memo.has(2)]).toEqual([false, false, false]);
    memo.set(0, 3, 4);
    memo.use(Number.NEGATIVE_INFINITY, Number.NEGATIVE_INFINITY, Number.POSITIVE_INFINITY);
    expect(memo.has(0)).toBe(true);
  });
});

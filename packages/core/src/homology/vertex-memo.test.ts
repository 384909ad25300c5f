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

  // White-box (the counter and the stamps are private): the stamp's wrap comes after 2^31 − 1 bands, far
  // past what a test can run (the memo is a cache, so a broken wrap only loses its hits, with no wrong number).
  type Inside = { stamp: number; stampOf: Int32Array };

  it("remembers vertices across the stamp's wrap after 2^31 − 1 bands (white-box: the counter set near it)", () => {
    const memo = new VertexMemo(3);
    (memo as unknown as Inside).stamp = 0x7fffffff - 3;
    for (let band = 0; band < 6; band++) {
      memo.use(band, band, band);
      expect(memo.has(1), `band ${band}, before set`).toBe(false);
      memo.set(1, band, -band);
      expect(memo.has(1), `band ${band}, after set`).toBe(true);
      expect(memo.has(0), `band ${band}, vertex never set`).toBe(false);
    }
  });

  it("forgets by a new stamp, not by clearing the arrays, so a new band costs O(1) (white-box)", () => {
    // The class's contract ("instead of clearing the arrays"): a vertex's stored stamp is left as it was.
    const memo = new VertexMemo(4);
    memo.use(1, 2, 3);
    memo.set(2, 5, 6);
    const stored = (memo as unknown as Inside).stampOf[2];
    expect(stored).not.toBe(0);
    memo.use(4, 5, 6);
    expect(memo.has(2)).toBe(false);
    expect((memo as unknown as Inside).stampOf[2]).toBe(stored);
  });
});

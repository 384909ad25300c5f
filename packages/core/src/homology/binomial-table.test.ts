import { describe, expect, it } from "vitest";
import { binomial, binomialTable, decodeSimplex, encodeSimplex } from "./binomial-table.js";

describe("binomialTable", () => {
  it("matches Pascal's rule values (common practice)", () => {
    const t = binomialTable(10, 4);
    expect(binomial(t, 10, 4)).toBe(210);
    expect(binomial(t, 5, 2)).toBe(10);
    expect(binomial(t, 3, 4)).toBe(0);
  });

  it("encodes every k-subset to a distinct index in 0 .. C(n,k)-1 and decodes it back", () => {
    const n = 9;
    const k = 4;
    const t = binomialTable(n, k);
    const seen = new Set<number>();
    const out = new Int32Array(k);
    const v = new Int32Array(k);
    const rec = (start: number, depth: number) => {
      if (depth === k) {
        const key = encodeSimplex(t, v, k);
        seen.add(key);
        decodeSimplex(t, key, k, out);
        expect(Array.from(out)).toEqual(Array.from(v));
        return;
      }
      for (let x = start; x < n; x++) {
        v[depth] = x;
        rec(x + 1, depth + 1);
      }
    };
    rec(0, 0);
    expect(seen.size).toBe(126);
    expect(Math.min(...seen)).toBe(0);
    expect(Math.max(...seen)).toBe(125);
  });

  it("refuses tables whose indices would not be exact", () => {
    expect(() => binomialTable(200000, 5)).toThrow(/2\^53/);
  });
});

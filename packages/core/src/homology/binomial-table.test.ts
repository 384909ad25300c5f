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

  it("decodes the last two digits at every boundary C(v, 2) − 1, C(v, 2) up to v = 2^20 (n = 2^20 + 1)", () => {
    // The pair digit is found in closed form from a square root; its rounding must not move a boundary.
    const n = 2 ** 20 + 1;
    const t = binomialTable(n, 2);
    const out = new Int32Array(2);
    const bad: string[] = [];
    for (let v = 1; v < n; v++) {
      const c = (v * (v - 1)) / 2; // C(v, 2): the pair {0, v}, and one less is {v − 2, v − 1}
      decodeSimplex(t, c, 2, out);
      if (out[0] !== 0 || out[1] !== v) bad.push(`${c} → ${out}`);
      if (v >= 2) {
        decodeSimplex(t, c - 1, 2, out);
        if (out[0] !== v - 2 || out[1] !== v - 1) bad.push(`${c - 1} → ${out}`);
      }
    }
    expect(bad.slice(0, 5)).toEqual([]);
  });

  it("decodes seeded random subsets of 2–5 of 1,500 vertices (C(1500, 5) < 2^53) back to themselves", () => {
    const n = 1500;
    const t = binomialTable(n, 5);
    let state = 7;
    const random = () => {
      state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
      return state / 2 ** 32;
    };
    for (let trial = 0; trial < 20_000; trial++) {
      const k = 2 + (trial % 4);
      const set = new Set<number>();
      while (set.size < k) set.add(Math.floor(random() * n));
      const v = Int32Array.from([...set].sort((a, b) => a - b));
      const out = new Int32Array(k);
      decodeSimplex(t, encodeSimplex(t, v, k), k, out);
      expect(Array.from(out)).toEqual(Array.from(v));
    }
  });

  it("refuses tables whose indices would not be exact", () => {
    expect(() => binomialTable(200000, 5)).toThrow(/2\^53/);
  });

  it("holds C(v, k) = v! / (k! (v − k)!) for every v ≤ n and k ≤ maxK, 0 for k > v (the definition)", () => {
    const n = 40;
    const maxK = 7;
    const t = binomialTable(n, maxK);
    const exact = (v: number, k: number): bigint => {
      if (k > v) return 0n;
      let c = 1n;
      for (let i = 0; i < k; i++) c = (c * BigInt(v - i)) / BigInt(i + 1);
      return c;
    };
    for (let k = 0; k <= maxK; k++)
      for (let v = 0; v <= n; v++) expect(BigInt(binomial(t, v, k))).toBe(exact(v, k));
  });

  it("decodes the largest and the smallest index of each size among many vertices", () => {
    const n = 60;
    const t = binomialTable(n, 5);
    const out = new Int32Array(5);
    for (let k = 1; k <= 5; k++) {
      const top = Array.from({ length: k }, (_, i) => n - k + i); // the last k vertices
      const key = encodeSimplex(t, top, k);
      expect(key).toBe(binomial(t, n, k) - 1);
      decodeSimplex(t, key, k, out);
      expect(Array.from(out.subarray(0, k))).toEqual(top);
      decodeSimplex(t, 0, k, out);
      expect(Array.from(out.subarray(0, k))).toEqual(Array.from({ length: k }, (_, i) => i));
    }
  });
});

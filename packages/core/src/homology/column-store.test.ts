import { describe, expect, it } from "vitest";
import { ColumnStore } from "./column-store.js";
import { ByteLedger, HomologyBudgetError } from "./homology-budget.js";

// Sizes from the class's documented layout: 12 bytes per column (chain start, chain length, pivot
// coefficient), 20 per chain entry (f64 key, f64 f, i32 coefficient); 256 columns and 1,024 entries first.

describe("ColumnStore", () => {
  it("keeps each column's pivot coefficient and chain through growth", () => {
    const store = new ColumnStore(new ByteLedger(undefined));
    const chains: number[][] = [];
    for (let c = 0; c < 700; c++) {
      const id = store.open(1 + (c % 4));
      expect(id).toBe(c);
      expect([store.chainStart[id], store.chainLength[id]]).toEqual([-1, 0]);
      const length = c === 300 ? 5000 : c % 9; // one chain longer than two doublings of the pool
      const key = new Float64Array(length + 3).fill(-7); // longer than length: the tail is not stored
      const f = new Float64Array(length + 3).fill(-7);
      const coef = new Int32Array(length + 3).fill(-7);
      for (let e = 0; e < length; e++) {
        key[e] = c * 1e4 + e;
        f[e] = c + e / 100;
        coef[e] = 1 + ((c + e) % 4);
      }
      store.setChain(id, key, f, coef, length);
      chains.push(Array.from(key.subarray(0, length)));
    }
    expect(store.columns).toBe(700);
    let used = 0;
    chains.forEach((keys, c) => {
      expect(store.pivotCoef[c]).toBe(1 + (c % 4));
      expect([store.chainStart[c], store.chainLength[c]]).toEqual([used, keys.length]);
      const s = store.chainStart[c];
      expect(Array.from(store.chainKey.subarray(s, s + keys.length))).toEqual(keys);
      for (let e = 0; e < keys.length; e++) {
        expect(store.chainF[s + e]).toBe(c + e / 100);
        expect(store.chainCoef[s + e]).toBe(1 + ((c + e) % 4));
      }
      used += keys.length;
    });
    expect(store.chainUsed).toBe(used);
  });

  it("holds its arrays in the ledger, grows them through it, and gives every byte back", () => {
    const ledger = new ByteLedger(undefined);
    const store = new ColumnStore(ledger);
    expect(ledger.held).toBe(256 * 12 + 1024 * 20);
    for (let c = 0; c < 257; c++) store.open(1);
    expect(store.chainStart.length).toBe(512);
    expect(store.chainLength.length).toBe(512);
    expect(store.pivotCoef.length).toBe(512);
    expect(ledger.held).toBe(512 * 12 + 1024 * 20);
    const n = 1024;
    store.setChain(0, new Float64Array(n), new Float64Array(n), new Int32Array(n), n);
    expect(store.chainKey.length).toBe(1024); // exactly full: no growth
    store.setChain(1, new Float64Array(1), new Float64Array(1), new Int32Array(1), 1);
    expect(store.chainKey.length).toBe(2048);
    expect(store.chainF.length).toBe(2048);
    expect(store.chainCoef.length).toBe(2048);
    expect(ledger.held).toBe(512 * 12 + 2048 * 20);
    store.dispose();
    expect(ledger.held).toBe(0);
  });

  it("names what it was doing when the budget runs out", () => {
    const ledger = new ByteLedger({ maxBytes: 256 * 12 + 1024 * 20 + 100 });
    const store = new ColumnStore(ledger);
    let error: unknown;
    try {
      store.setChain(
        store.open(1),
        new Float64Array(2000),
        new Float64Array(2000),
        new Int32Array(2000),
        2000,
      );
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(HomologyBudgetError);
    expect((error as HomologyBudgetError).stage).toBe("storing reduced columns");
    expect(() => new ColumnStore(new ByteLedger({ maxBytes: 256 * 12 + 1024 * 20 - 1 }))).toThrow(
      /storing reduced columns/,
    );
    expect(() => {
      for (let c = 0; c < 300; c++) store.open(1);
    }).toThrow(/storing reduced columns/);
  });
});

import { describe, expect, it } from "vitest";
import { ByteLedger, HomologyBudgetError } from "./homology-budget.js";
import { KeyMap } from "./key-map.js";

describe("KeyMap", () => {
  it("stores and finds large integer keys like a Map does (Map as the reference)", () => {
    const map = new KeyMap(new ByteLedger(undefined), "test", 4);
    const reference = new Map<number, number>();
    let x = 12345;
    for (let i = 0; i < 5000; i++) {
      x = (x * 1103515245 + 12345) % 2147483648;
      const key = x * 1048573 + i; // above 2^32 to exercise both halves
      map.set(key, i);
      reference.set(key, i);
    }
    expect(map.size).toBe(reference.size);
    for (const [k, v] of reference) expect(map.get(k)).toBe(v);
    expect(map.get(7)).toBe(-1);
    expect(map.has(0)).toBe(false);
  });

  it("keeps small keys, 0 and 1 among them, through every growth", () => {
    const map = new KeyMap(new ByteLedger(undefined), "test", 4);
    for (let key = 0; key < 300; key++) {
      map.set(key, 1000 - key);
      for (let k = 0; k <= key; k++) expect(map.get(k)).toBe(1000 - k);
    }
    expect(map.size).toBe(300);
  });

  it("stops with a budget error instead of growing past the budget", () => {
    const map = new KeyMap(new ByteLedger({ maxBytes: 100_000 }), "testing growth", 16);
    expect(() => {
      for (let i = 0; i < 100_000; i++) map.set(i, i);
    }).toThrow(HomologyBudgetError);
  });

  it("holds its table in the ledger, at most half full, and gives every byte back", () => {
    // 12 bytes per slot (f64 key, i32 value); open addressing keeps at least half of the slots empty.
    const ledger = new ByteLedger(undefined);
    const map = new KeyMap(ledger, "test", 4);
    for (let i = 0; i < 3000; i++) {
      map.set(i * 7919, i);
      const slots = ledger.held / 12;
      expect(Number.isInteger(Math.log2(slots))).toBe(true);
      expect(slots).toBeGreaterThanOrEqual(2 * map.size);
    }
    expect(ledger.held).toBeLessThanOrEqual(12 * 4 * 3000);
    map.dispose();
    expect(ledger.held).toBe(0);
  });

  it("overwrites the value of a key set twice, and names the stage a budget error came from", () => {
    const map = new KeyMap(new ByteLedger(undefined), "test", 4);
    map.set(2 ** 40 + 3, 1);
    map.set(2 ** 40 + 3, 9);
    expect(map.size).toBe(1);
    expect(map.get(2 ** 40 + 3)).toBe(9);
    expect(map.has(2 ** 40 + 3)).toBe(true);
    const small = new KeyMap(new ByteLedger({ maxBytes: 1000 }), "recording pivots", 4);
    let error: unknown;
    try {
      for (let i = 0; i < 100; i++) small.set(i, i);
    } catch (e) {
      error = e;
    }
    expect((error as HomologyBudgetError).stage).toBe("recording pivots");
  });

  it("reserves room for initialCapacity keys up front and takes that many without growing", () => {
    // The callers size a map for the keys they will set (n vertices, the columns to reduce), so the budget
    // is asked once, before the work. Room for k keys at most half full: the smallest power of two ≥ 2k,
    // 16 slots at least (worked by hand: 4 → 16, 1000 → 2048, 1024 → 2048, 1025 → 4096).
    for (const [initial, slots] of [
      [4, 16],
      [1000, 2048],
      [1024, 2048],
      [1025, 4096],
    ]) {
      const ledger = new ByteLedger(undefined);
      const map = new KeyMap(ledger, "test", initial);
      expect(ledger.held).toBe(12 * slots);
      for (let i = 0; i < Math.max(initial, 8); i++) map.set(3 * i + 2 ** 33, i);
      // Filled to half (8 of 16, 1024 of 2048): still the same table.
      expect(ledger.held).toBe(12 * slots);
      if (initial === 1024) {
        map.set(1, 1); // the 1025th key passes half: the table doubles
        expect(ledger.held).toBe(12 * 2 * slots);
        expect(ledger.peak).toBe(12 * 3 * slots); // old and new table held together while rehashing
      }
    }
  });
});

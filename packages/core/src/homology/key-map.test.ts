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

  it("stops with a budget error instead of growing past the budget", () => {
    const map = new KeyMap(new ByteLedger({ maxBytes: 100_000 }), "testing growth", 16);
    expect(() => {
      for (let i = 0; i < 100_000; i++) map.set(i, i);
    }).toThrow(HomologyBudgetError);
  });
});

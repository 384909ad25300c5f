import { describe, expect, it } from "vitest";
import { ChainBuilder } from "./chain-builder.js";
import { ByteLedger, HomologyBudgetError } from "./homology-budget.js";

describe("ChainBuilder", () => {
  it("sorts by key and sums coefficients mod p, like a Map tally (common practice)", () => {
    const chain = new ChainBuilder(new ByteLedger(undefined), 4);
    const tally = new Map<number, number>();
    let x = 3;
    for (let i = 0; i < 2000; i++) {
      x = (x * 69069 + 1) % 4294967296;
      const key = x % 97;
      const coef = 1 + (x % 4);
      chain.push(key, key / 10, coef);
      tally.set(key, ((tally.get(key) ?? 0) + coef) % 5);
    }
    chain.compact(5);
    const expected = [...tally].filter(([, c]) => c !== 0).sort((a, b) => a[0] - b[0]);
    expect(Array.from(chain.key.subarray(0, chain.size))).toEqual(expected.map(([k]) => k));
    expect(Array.from(chain.coef.subarray(0, chain.size))).toEqual(expected.map(([, c]) => c));
    expect(Array.from(chain.f.subarray(0, chain.size))).toEqual(expected.map(([k]) => k / 10));
  });

  it("gives the same tally when the keys are too large to sort packed with their positions (up to 2^53)", () => {
    // Keys of 4-simplices among many vertices come close to 2^53; then the comparison sort is used.
    for (const base of [0, 2 ** 40, 2 ** 52]) {
      const chain = new ChainBuilder(new ByteLedger(undefined), 4);
      const tally = new Map<number, number>();
      let x = 11;
      for (let i = 0; i < 3000; i++) {
        x = (x * 69069 + 1) % 4294967296;
        const key = base + (x % 389) * 7;
        const coef = 1 + (x % 6);
        chain.push(key, key, coef);
        tally.set(key, ((tally.get(key) ?? 0) + coef) % 7);
      }
      chain.compact(7);
      const expected = [...tally].filter(([, c]) => c !== 0).sort((a, b) => a[0] - b[0]);
      expect(Array.from(chain.key.subarray(0, chain.size)), `keys from ${base}`).toEqual(
        expected.map(([k]) => k),
      );
      expect(Array.from(chain.coef.subarray(0, chain.size))).toEqual(expected.map(([, c]) => c));
      expect(Array.from(chain.f.subarray(0, chain.size))).toEqual(expected.map(([k]) => k));
    }
  });

  it("keeps positions exact at the edge of the packed sort: key·4 = 2^53 with four entries", () => {
    // With 4 entries the positions take 2 bits; a key of 2^51 would pack to 2^53 + position, where doubles
    // are 2 apart, so that chain must take the comparison sort (keys and coefficients kept together).
    const chain = new ChainBuilder(new ByteLedger(undefined), 4);
    const keys = [5, 2 ** 51, 2 ** 51 - 1, 7]; // 2^51 at position 1: 2^53 + 1 is not a double
    for (const [i, key] of keys.entries()) chain.push(key, i, i + 1);
    chain.compact(11);
    expect(Array.from(chain.key.subarray(0, 4))).toEqual([5, 7, 2 ** 51 - 1, 2 ** 51]);
    expect(Array.from(chain.f.subarray(0, 4))).toEqual([0, 3, 2, 1]);
    expect(Array.from(chain.coef.subarray(0, 4))).toEqual([1, 4, 3, 2]);
  });

  it("sorts only its own entries when the keys are too large to pack (zeros lie past the size)", () => {
    // Three keys near 2^51 with room 4: key · 4 reaches 2^53, so the comparison sort runs; slots 3 … 7 of
    // the arrays hold zeros, which must stay out of the sort (worked by hand).
    const chain = new ChainBuilder(new ByteLedger(undefined), 8);
    const keys = [2 ** 51 + 2, 2 ** 51, 2 ** 51 + 1];
    for (const [i, key] of keys.entries()) chain.push(key, i, i + 1);
    chain.compact(7);
    expect(Array.from(chain.key.subarray(0, chain.size))).toEqual([2 ** 51, 2 ** 51 + 1, 2 ** 51 + 2]);
    expect(Array.from(chain.coef.subarray(0, chain.size))).toEqual([2, 3, 1]);
    expect(Array.from(chain.f.subarray(0, chain.size))).toEqual([1, 2, 0]);
  });

  it("reads nothing past its size when used again after clear() (tallies worked by hand)", () => {
    const chain = new ChainBuilder(new ByteLedger(undefined), 8);
    for (const key of [1, 2, 3, 3]) chain.push(key, key, 1);
    chain.compact(5);
    expect(Array.from(chain.coef.subarray(0, chain.size))).toEqual([1, 1, 2]);
    // Key 3 and its old coefficients still sit past the size; the new chain 3 + 2 must not see them.
    chain.clear();
    chain.push(3, 3, 1);
    chain.push(2, 2, 1);
    chain.compact(5);
    expect(Array.from(chain.key.subarray(0, chain.size))).toEqual([2, 3]);
    expect(Array.from(chain.coef.subarray(0, chain.size))).toEqual([1, 1]);
  });

  it("holds its arrays and as much again for sorting in the ledger, and gives every byte back", () => {
    // The ledger against the arrays' own byteLength (8 per f64 key and f, 4 per i32 coefficient: 20 a slot),
    // doubled for the packed sort's scratch space, as the class documents.
    const ledger = new ByteLedger(undefined);
    const chain = new ChainBuilder(ledger, 8);
    const held = () => 2 * (chain.key.byteLength + chain.f.byteLength + chain.coef.byteLength);
    expect(ledger.held).toBe(held());
    for (let i = 0; i < 70; i++) {
      chain.push(i, i, 1);
      expect(ledger.held).toBe(held());
    }
    expect(chain.key.length).toBe(128);
    chain.dispose();
    expect(ledger.held).toBe(0);
    let error: unknown;
    try {
      new ChainBuilder(new ByteLedger({ maxBytes: 1000 }), 26); // 26 · 40 = 1040 bytes
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(HomologyBudgetError);
    expect((error as HomologyBudgetError).stage).toBe("tracking reduction chains");
    // Growing: 8 slots (320 bytes), 16 (640), then 32 would hold 1280 > 1000.
    const growing = new ChainBuilder(new ByteLedger({ maxBytes: 1000 }), 8);
    error = undefined;
    try {
      for (let i = 0; i < 17; i++) growing.push(i, i, 1);
    } catch (e) {
      error = e;
    }
    expect(growing.size).toBe(16);
    expect(error).toMatchObject({ stage: "tracking reduction chains", neededBytes: 1280 });
  });
});

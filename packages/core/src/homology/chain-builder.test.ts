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

  it("tallies long chains exactly: sums past 2^32 mod 65521, keys up to 2^53, every sum zero (Map tally, common practice)", () => {
    // 70,000 copies of one key with coefficient 65520 sum to about 4.6 · 10^9, past a 32-bit integer; the
    // other keys spread over 2^53 so that both halves of the key feed the hash.
    const p = 65521;
    const chain = new ChainBuilder(new ByteLedger(undefined), 4);
    const tally = new Map<number, number>();
    const add = (key: number, coef: number): void => {
      chain.push(key, key / 4, coef);
      tally.set(key, ((tally.get(key) ?? 0) + coef) % p);
    };
    let x = 7;
    for (let i = 0; i < 70000; i++) {
      add(12345, p - 1);
      x = (x * 69069 + 1) % 4294967296;
      add((x % 5000) * 2 ** 40 + (x % 3), 1 + (x % 1000));
    }
    chain.compact(p);
    const expected = [...tally].filter(([, c]) => c !== 0).sort((a, b) => a[0] - b[0]);
    expect(chain.size).toBe(expected.length);
    expect(Array.from(chain.key.subarray(0, chain.size))).toEqual(expected.map(([k]) => k));
    expect(Array.from(chain.coef.subarray(0, chain.size))).toEqual(expected.map(([, c]) => c));
    expect(Array.from(chain.f.subarray(0, chain.size))).toEqual(expected.map(([k]) => k / 4));
    // A chain that cancels completely (each key twice over Z/2) leaves nothing.
    chain.clear();
    for (let i = 0; i < 600; i++) chain.push(i * 977, i, 1);
    for (let i = 599; i >= 0; i--) chain.push(i * 977, i, 1);
    chain.compact(2);
    expect(chain.size).toBe(0);
    // The table is reused, not cleared: the tally above must not leak into the next (worked by hand).
    chain.clear();
    for (let i = 0; i < 600; i++) chain.push(i * 977, i, 2);
    chain.compact(5);
    expect(chain.size).toBe(600);
    expect(Array.from(chain.coef.subarray(0, 600)).every((c) => c === 2)).toBe(true);
  });

  it("folds scaled chains of other arrays into its own, tallied or appended, like a Map tally (common practice)", () => {
    // A new pivot's chain: its own entries, then factor × the chains of the stored columns added to it,
    // read from the store's arrays. Below 256 entries in all they are appended, from 256 on they go
    // straight into the tally; both must give the Map's sums mod p, with each key's f.
    const p = 7;
    let x = 5;
    const next = () => {
      x = (x * 69069 + 1) % 4294967296;
      return x;
    };
    const chain = new ChainBuilder(new ByteLedger(undefined), 4);
    for (const [own, stored, length] of [
      [3, 4, 20], // 83 entries: appended
      [3, 40, 200], // 8,003 entries over about 6,600 keys: tallied, the table doubling from 8,192 slots
      [300, 2, 10], // tallied because of its own entries
      [3, 40, 200], // doubling again inside the table the second case left: old slots must not count
    ]) {
      chain.clear();
      const tally = new Map<number, number>();
      for (let i = 0; i < own; i++) {
        const key = 1 + (next() % 999); // key 0 comes once, below
        chain.push(key, key + 0.5, 1 + (key % 6));
        tally.set(key, ((tally.get(key) ?? 0) + 1 + (key % 6)) % p);
      }
      const key = new Float64Array(stored * length);
      const f = new Float64Array(stored * length);
      const coef = new Int32Array(stored * length);
      for (let e = 0; e < key.length; e++) {
        key[e] = 1 + (next() % 19999);
        f[e] = key[e] + 0.5;
        coef[e] = 1 + (next() % (p - 1));
      }
      chain.openTally(stored * length);
      for (let a = 0; a < stored; a++) {
        const factor = 1 + (a % (p - 1)); // 1 (no product) and 2 … 6
        chain.addScaled(key, f, coef, a * length, (a + 1) * length, factor, p);
        for (let e = a * length; e < (a + 1) * length; e++)
          tally.set(key[e], ((tally.get(key[e]) ?? 0) + factor * coef[e]) % p);
      }
      chain.push(999, 999.5, 1); // an entry pushed while a tally is open goes into it
      tally.set(999, ((tally.get(999) ?? 0) + 1) % p);
      // Key 0 hashes to slot 0 at every table size: in every case, so that a doubling that let the last
      // tally's slots count as filled would meet the previous case's key 0 there.
      chain.push(0, 0.5, 1);
      tally.set(0, ((tally.get(0) ?? 0) + 1) % p);
      chain.compact(p);
      const expected = [...tally].filter(([, c]) => c !== 0).sort((a, b) => a[0] - b[0]);
      const label = `own ${own}, ${stored} × ${length}`;
      expect(Array.from(chain.key.subarray(0, chain.size)), label).toEqual(expected.map(([k]) => k));
      expect(Array.from(chain.coef.subarray(0, chain.size)), label).toEqual(expected.map(([, c]) => c));
      expect(Array.from(chain.f.subarray(0, chain.size)), label).toEqual(expected.map(([k]) => k + 0.5));
      // The next chain starts empty, even after clear() with a tally open.
      for (let i = 0; i < 300; i++) chain.push(i, i, 1);
      chain.openTally(0);
      chain.clear();
      chain.push(3, 3, 1);
      chain.compact(p);
      expect([chain.size, chain.key[0], chain.coef[0]]).toEqual([1, 3, 1]);
    }
  });

  it("holds every survivor when a tally opens on a long chain with more keys to come (Map tally, common practice)", () => {
    // 1,000 entries of its own (capacity 1,024), then 200 more keys from another chain: 1,200 survivors, so
    // the arrays must grow for all of them before the tally writes them back.
    const chain = new ChainBuilder(new ByteLedger(undefined), 4);
    for (let i = 0; i < 1000; i++) chain.push(2 * i, i, 1);
    const more = new Float64Array(200).map((_, e) => 2 * e + 1);
    chain.openTally(200);
    chain.addScaled(more, more, new Int32Array(200).fill(1), 0, 200, 1, 3);
    chain.compact(3);
    expect(chain.size).toBe(1200);
    const keys = Array.from(chain.key.subarray(0, 1200));
    expect(keys).toEqual([...keys].sort((a, b) => a - b));
    expect(new Set(keys).size).toBe(1200);
    // Pushed after a tally closed: appended to the arrays, where the reduction reads the chain.
    chain.push(5000, 1, 2);
    chain.push(5001, 1, 2);
    expect(chain.size).toBe(1202);
    expect(Array.from(chain.key.subarray(1200, 1202))).toEqual([5000, 5001]);
  });

  it("renews its stamp when the table doubles inside an array left larger by an earlier tally", () => {
    // Key 10,946 hashes to slot 0 of tables of 8,192 and 16,384 slots (its Fibonacci hash is below 2^18),
    // so when the table doubles it goes back to the slot it held: that slot must then read as empty.
    const chain = new ChainBuilder(new ByteLedger(undefined), 4);
    for (let i = 0; i < 20000; i++) chain.push(i + 20000, 0, 1); // a table of 65,536 slots
    chain.compact(2);
    chain.clear();
    chain.push(10946, 1, 1);
    for (let i = 1; i <= 5000; i++) chain.push(3 * i, 0, 1); // 5,001 keys: 8,192 slots, then 16,384
    chain.compact(2);
    expect(chain.size).toBe(5001);
    expect(chain.key.subarray(0, chain.size)).toContain(10946);
  });

  it("drops keys that cancel in a short chain, which is sorted without a tally (worked by hand)", () => {
    const chain = new ChainBuilder(new ByteLedger(undefined), 4);
    chain.push(5, 5, 2);
    chain.push(9, 9, 1);
    chain.push(5, 5, 3); // 2 + 3 = 0 mod 5
    chain.compact(5);
    expect(Array.from(chain.key.subarray(0, chain.size))).toEqual([9]);
    expect(Array.from(chain.coef.subarray(0, chain.size))).toEqual([1]);
  });

  it("holds its arrays, the sort's scratch space and the tally's table in the ledger, and gives every byte back", () => {
    // The class documents 108 bytes a slot of capacity: 20 for key, f and coefficient, 20 for the packed
    // sort's scratch space, 68 for the tally's table of at most twice as many slots and its list.
    const ledger = new ByteLedger(undefined);
    const chain = new ChainBuilder(ledger, 8);
    expect(ledger.held).toBe(108 * chain.key.length);
    for (let i = 0; i < 700; i++) {
      chain.push(i % 500, i, 1);
      expect(ledger.held).toBe(108 * chain.key.length);
    }
    expect(chain.key.length).toBe(1024);
    chain.compact(3);
    expect(chain.size).toBe(500);
    // Every array the chain allocated, scratch and table included, within what the ledger holds.
    const bytes = Object.values(chain as unknown as Record<string, unknown>)
      .filter((v): v is Float64Array | Int32Array => ArrayBuffer.isView(v))
      .reduce((sum, a) => sum + a.byteLength, 0);
    expect(bytes).toBeGreaterThan(60 * chain.key.length); // the table and scratch space are there
    expect(bytes).toBeLessThanOrEqual(ledger.held);
    chain.dispose();
    expect(ledger.held).toBe(0);
    let error: unknown;
    try {
      new ChainBuilder(new ByteLedger({ maxBytes: 1000 }), 9); // rounded up to 16 slots: 1728 bytes
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(HomologyBudgetError);
    expect((error as HomologyBudgetError).stage).toBe("tracking reduction chains");
    // Growing under 2000 bytes: 8 slots (864), 16 (1728), then 32 would hold 3456.
    const growing = new ChainBuilder(new ByteLedger({ maxBytes: 2000 }), 8);
    error = undefined;
    try {
      for (let i = 0; i < 17; i++) growing.push(i, i, 1);
    } catch (e) {
      error = e;
    }
    expect(growing.size).toBe(16);
    expect(error).toMatchObject({ stage: "tracking reduction chains", neededBytes: 3456 });
  });
});

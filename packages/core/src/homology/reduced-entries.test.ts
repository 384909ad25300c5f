import { describe, expect, it } from "vitest";
import { ByteLedger, HomologyBudgetError } from "./homology-budget.js";
import { ReducedEntries } from "./reduced-entries.js";

// Sizes from the class's documented layout: 20 bytes per stored entry (f64 f, f64 key, i32 coefficient),
// 20 per column; 256 columns and 1,024 entries to begin with; entries take at most a quarter of the budget.

describe("ReducedEntries", () => {
  it("keeps every entry and every column's start, length and cover through growth", () => {
    const store = new ReducedEntries(new ByteLedger(undefined));
    let id = 0;
    const columns: [number, number, number][] = [];
    for (let c = 0; c < 600; c++) {
      const from = store.used;
      const count = c % 7;
      expect(store.reserveEntries(count)).toBe(true);
      for (let e = 0; e < count; e++) store.append(c + e / 10, c * 10 + e, (c + e) % 5);
      store.close(id, from, c % 3 === 0 ? Number.POSITIVE_INFINITY : c);
      columns.push([from, count, c % 3 === 0 ? Number.POSITIVE_INFINITY : c]);
      id += 2; // every other id, so some ids are never closed
    }
    expect(store.used).toBe(columns.reduce((s, [, n]) => s + n, 0));
    columns.forEach(([from, count, cover], c) => {
      expect([store.start[2 * c], store.length[2 * c], store.cover[2 * c]]).toEqual([from, count, cover]);
      expect(store.has(2 * c)).toBe(true);
      expect(store.has(2 * c + 1)).toBe(false);
      for (let e = 0; e < count; e++) {
        expect([store.entryF[from + e], store.entryKey[from + e], store.entryCoef[from + e]]).toEqual([
          c + e / 10,
          c * 10 + e,
          (c + e) % 5,
        ]);
      }
    });
    expect(store.has(store.cover.length)).toBe(false);
    expect(store.has(1e9)).toBe(false);
  });

  it("holds its arrays in the ledger, grows them through it, and gives every byte back", () => {
    const ledger = new ByteLedger(undefined);
    const store = new ReducedEntries(ledger);
    expect(ledger.held).toBe(256 * 20 + 1024 * 20);
    expect(store.reserveEntries(1024)).toBe(true);
    expect(ledger.held).toBe(256 * 20 + 1024 * 20);
    expect(store.reserveEntries(1025)).toBe(true);
    expect(ledger.held).toBe(256 * 20 + 2048 * 20);
    expect(store.entryF.length).toBe(2048);
    expect(store.reserveEntries(5000)).toBe(true); // two doublings at once
    expect(store.entryF.length).toBe(8192);
    expect(store.entryKey.length).toBe(8192);
    expect(store.entryCoef.length).toBe(8192);
    expect(ledger.held).toBe(256 * 20 + 8192 * 20);
    store.close(256, 0, 1);
    expect(ledger.held).toBe(512 * 20 + 8192 * 20);
    expect(store.length.length).toBe(512);
    store.dispose();
    expect(ledger.held).toBe(0);
  });

  it("refuses room past a quarter of the budget, and past the budget itself, without an error", () => {
    // 40,000 bytes: at most 500 entries.
    const small = new ReducedEntries(new ByteLedger({ maxBytes: 40_000 }));
    expect(small.reserveEntries(500)).toBe(true);
    expect(small.reserveEntries(501)).toBe(false);
    for (let e = 0; e < 499; e++) small.append(e, e, 1);
    expect(small.reserveEntries(1)).toBe(true);
    small.append(499, 499, 1);
    expect(small.reserveEntries(1)).toBe(false);

    // 1,000,000 bytes: 12,500 entries by the share, but other tables hold most of the budget.
    const ledger = new ByteLedger({ maxBytes: 1_000_000 });
    const store = new ReducedEntries(ledger);
    ledger.reserve(1_000_000 - 25_600 - 1024 * 20, "other tables");
    expect(store.reserveEntries(2048)).toBe(true); // the growth fills the budget exactly
    expect(ledger.held).toBe(1_000_000);
    expect(store.reserveEntries(2049)).toBe(false);
    expect(ledger.held).toBe(1_000_000);
    expect(store.entryF.length).toBe(2048);
  });

  it("names what it was doing when the budget runs out", () => {
    const ledger = new ByteLedger({ maxBytes: 30_000 });
    const store = new ReducedEntries(ledger);
    let error: unknown;
    try {
      store.close(256, 0, 1);
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(HomologyBudgetError);
    expect((error as HomologyBudgetError).stage).toBe("storing reduced entries");
    expect(() => new ReducedEntries(new ByteLedger({ maxBytes: 25_599 }))).toThrow(/storing reduced entries/);
  });
});

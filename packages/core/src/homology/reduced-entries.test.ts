import { describe, expect, it } from "vitest";
import { errorOf } from "../../../../test/support/error-of.js";
import { ByteLedger, HomologyBudgetError } from "./homology-budget.js";
import { ReducedEntries } from "./reduced-entries.js";

// Sizes from the class's documented layout: 20 bytes per stored entry (f64 f, f64 key, i32 coefficient),
// 24 per column, 12 per segment; 256 columns, 256 segments and 1,024 entries to begin with; entries take at
// most a quarter of the budget.
const START = 256 * 24 + 256 * 12 + 1024 * 20;

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
    expect(ledger.held).toBe(START);
    expect(store.reserveEntries(1024)).toBe(true);
    expect(ledger.held).toBe(START);
    expect(store.reserveEntries(1025)).toBe(true);
    expect(ledger.held).toBe(START + 1024 * 20);
    expect(store.entryF.length).toBe(2048);
    expect(store.reserveEntries(5000)).toBe(true); // two doublings at once
    expect(store.entryF.length).toBe(8192);
    expect(store.entryKey.length).toBe(8192);
    expect(store.entryCoef.length).toBe(8192);
    expect(ledger.held).toBe(START + 7168 * 20);
    store.close(256, 0, 1);
    expect(ledger.held).toBe(START + 7168 * 20 + 256 * 24);
    expect(store.length.length).toBe(512);
    for (let s = 0; s < 257; s++) store.extend(256, new ReducedEntries(new ByteLedger(undefined)), s);
    expect(store.segmentStart.length).toBe(512);
    expect(ledger.held).toBe(START + 7168 * 20 + 256 * 24 + 256 * 12);
    store.dispose();
    expect(ledger.held).toBe(0);
  });

  it("continues columns with segments appended later, each linked after the column's last", () => {
    const store = new ReducedEntries(new ByteLedger(undefined));
    const more = new ReducedEntries(new ByteLedger(undefined));
    const fill = (values: number[]): ReducedEntries => {
      more.used = 0;
      expect(more.reserveEntries(values.length)).toBe(true);
      for (const v of values) more.append(v, 10 * v, v % 3);
      return more;
    };
    // Columns 0 and 1 first, then their extensions interleaved in the store.
    store.reserveEntries(3);
    store.append(1, 10, 1);
    store.close(0, 0, 1);
    store.append(2, 20, 2);
    store.append(3, 30, 0);
    store.close(1, 1, 3);
    expect([store.firstSegment[0], store.firstSegment[1]]).toEqual([-1, -1]);
    const a = store.extend(0, fill([4, 5]), 6);
    const b = store.extend(1, fill([7]), 8);
    const c = store.extend(0, fill([9, 10, 11]), Number.POSITIVE_INFINITY);
    expect([a, b, c]).toEqual([0, 1, 2]);
    expect([store.firstSegment[0], store.segmentNext[a], store.segmentNext[c]]).toEqual([a, c, -1]);
    expect([store.firstSegment[1], store.segmentNext[b]]).toEqual([b, -1]);
    expect([store.cover[0], store.cover[1]]).toEqual([Number.POSITIVE_INFINITY, 8]);
    // The first entries stay where they were; each segment holds its entries, in order.
    expect([store.start[0], store.length[0], store.start[1], store.length[1]]).toEqual([0, 1, 1, 2]);
    const read = (s: number): number[] =>
      Array.from(
        store.entryF.subarray(store.segmentStart[s], store.segmentStart[s] + store.segmentLength[s]),
      );
    expect([read(a), read(b), read(c)]).toEqual([[4, 5], [7], [9, 10, 11]]);
    expect(Array.from(store.entryKey.subarray(store.segmentStart[c], store.used))).toEqual([90, 100, 110]);
    expect(Array.from(store.entryCoef.subarray(store.segmentStart[c], store.used))).toEqual([0, 1, 2]);
    expect(store.used).toBe(9);
  });

  it("leaves everything as it was when a segment finds no room", () => {
    // 40,000 bytes: at most 500 entries.
    const store = new ReducedEntries(new ByteLedger({ maxBytes: 40_000 }));
    const more = new ReducedEntries(new ByteLedger(undefined));
    store.reserveEntries(400);
    for (let e = 0; e < 400; e++) store.append(e, e, 1);
    store.close(0, 0, 399);
    more.reserveEntries(101);
    for (let e = 400; e < 501; e++) more.append(e, e, 1);
    expect(store.extend(0, more, 500)).toBe(-1);
    expect([store.used, store.segmentCount, store.firstSegment[0], store.cover[0]]).toEqual([
      400, 0, -1, 399,
    ]);
    more.used = 100;
    expect(store.extend(0, more, 499)).toBe(0);
    expect([store.used, store.segmentCount, store.firstSegment[0], store.cover[0]]).toEqual([500, 1, 0, 499]);
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
    ledger.reserve(1_000_000 - START - 1024 * 20, "other tables");
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
    expect(() => new ReducedEntries(new ByteLedger({ maxBytes: START - 1 }))).toThrow(
      /storing reduced entries/,
    );
  });

  it("names it too when the segments' table cannot grow", () => {
    // Room for the first 256 segments and for the entries (a quarter of the budget is 383 of them), not
    // for doubling the segments' table (256 × 12 bytes more): the 257th extension must fail with the stage.
    const ledger = new ByteLedger({ maxBytes: START + 1000 });
    const store = new ReducedEntries(ledger);
    store.reserveEntries(1);
    store.append(1, 1, 1);
    store.close(0, 0, 1);
    const more = new ReducedEntries(new ByteLedger(undefined));
    more.reserveEntries(1);
    more.append(2, 2, 1);
    for (let s = 0; s < 256; s++) expect(store.extend(0, more, 2)).toBe(s);
    const error = errorOf(() => store.extend(0, more, 2), HomologyBudgetError);
    expect(error.stage).toBe("storing reduced entries");
  });
});

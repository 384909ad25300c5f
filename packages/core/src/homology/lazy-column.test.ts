import { describe, expect, it } from "vitest";
import { ByteLedger } from "./homology-budget.js";
import { LazyColumn } from "./lazy-column.js";
import { ReducedEntries } from "./reduced-entries.js";

// The reference is the definition of the column: the sum mod p of every entry pushed (and of factor × every
// stored entry added), equal keys summed, zeros dropped, in filtration order (f, then key). Worked in plain
// arrays and a Map here, independently of the heap and the cursors.

interface Entry {
  f: number;
  key: number;
  coef: number;
}

/** Filtration value of a key: not monotone in the key, so that f and not the key decides the order. */
const fOf = (key: number): number => (key * 7) % 5;

function tally(entries: Entry[], p: number): Entry[] {
  const sums = new Map<number, Entry>();
  for (const e of entries) {
    const s = sums.get(e.key);
    if (s) s.coef += e.coef;
    else sums.set(e.key, { ...e });
  }
  return [...sums.values()]
    .map((e) => ({ f: e.f, key: e.key, coef: e.coef % p }))
    .filter((e) => e.coef !== 0)
    .sort((a, b) => a.f - b.f || a.key - b.key);
}

function lcg(seed: number): () => number {
  let x = seed;
  return () => {
    x = (x * 48271) % 2147483647;
    return x;
  };
}

function randomEntries(next: () => number, count: number, keys: number, p: number): Entry[] {
  const out: Entry[] = [];
  for (let i = 0; i < count; i++) {
    const key = next() % keys;
    out.push({ f: fOf(key), key, coef: next() % p });
  }
  return out;
}

function stored(out: ReducedEntries, from: number, to: number): Entry[] {
  const list: Entry[] = [];
  for (let i = from; i < to; i++)
    list.push({ f: out.entryF[i], key: out.entryKey[i], coef: out.entryCoef[i] });
  return list;
}

/** A stored column: `entries` (sorted, distinct keys) appended to `store` as column `id`. */
function storeColumn(store: ReducedEntries, id: number, entries: Entry[], cover: number): void {
  const from = store.used;
  expect(store.reserveEntries(entries.length)).toBe(true);
  for (const e of entries) store.append(e.f, e.key, e.coef);
  store.close(id, from, cover);
}

/**
 * `count` random stored columns (distinct keys, sorted) with random factors: their ranges for addStored, and
 * their entries times the factors (what adding them contributes).
 */
function randomStoredColumns(
  next: () => number,
  store: ReducedEntries,
  count: number,
  p: number,
): { added: Entry[]; ranges: [number, number, number][] } {
  const added: Entry[] = [];
  const ranges: [number, number, number][] = [];
  for (let c = 0; c < count; c++) {
    const own = tally(randomEntries(next, next() % 8, 40, p), p);
    const from = store.used;
    storeColumn(store, c, own, Number.POSITIVE_INFINITY);
    const factor = 1 + (next() % (p - 1));
    ranges.push([from, store.used, factor]);
    for (const e of own) added.push({ ...e, coef: e.coef * factor });
  }
  return { added, ranges };
}

/** The column's pivot is the first entry of `expected`, and draining it all into `store` gives `expected`. */
function expectSettlesAndDrains(column: LazyColumn, store: ReducedEntries, expected: Entry[]): void {
  expect(column.settle()).toBe(expected.length > 0);
  if (expected.length > 0) {
    expect([column.pivotF, column.pivotKey, column.pivotCoef]).toEqual([
      expected[0].f,
      expected[0].key,
      expected[0].coef,
    ]);
  }
  const from = store.used;
  expect(column.drainInto(store, 1e9, Number.NEGATIVE_INFINITY)).toBe(Number.POSITIVE_INFINITY);
  expect(stored(store, from, store.used)).toEqual(expected);
}

function newColumn(p: number, capacity = 4): LazyColumn {
  const column = new LazyColumn(new ByteLedger(undefined), capacity);
  column.reset(p);
  return column;
}

describe("LazyColumn", () => {
  it("settles on the first entry whose coefficients sum to non-zero mod p, and keeps it", () => {
    for (const p of [2, 3, 5, 7]) {
      for (let seed = 1; seed <= 20; seed++) {
        const next = lcg(seed * 7919 + p);
        const pushed = randomEntries(next, 5 + (next() % 60), 30, p);
        const expected = tally(pushed, p);
        const column = newColumn(p);
        for (const e of pushed) column.push(e.f, e.key, e.coef);
        expect(column.settle()).toBe(expected.length > 0);
        if (expected.length === 0) {
          expect(column.size).toBe(0);
          continue;
        }
        expect([column.pivotF, column.pivotKey, column.pivotCoef]).toEqual([
          expected[0].f,
          expected[0].key,
          expected[0].coef,
        ]);
        expect(column.floor).toBe(expected[0].f);
        // Settling again finds the same pivot: it was put back.
        expect(column.settle()).toBe(true);
        expect(column.pivotKey).toBe(expected[0].key);
        const out = new ReducedEntries(new ByteLedger(undefined));
        expect(column.drainInto(out, 1e9, Number.NEGATIVE_INFINITY)).toBe(Number.POSITIVE_INFINITY);
        expect(stored(out, 0, out.used)).toEqual(expected);
        expect(column.drained).toBe(expected.length);
        expect(column.size).toBe(0);
      }
    }
  });

  it("is zero when every key cancels mod p", () => {
    const column = newColumn(3);
    column.push(2, 7, 1);
    column.push(1, 4, 2);
    column.push(2, 7, 2);
    column.push(1, 4, 1);
    column.push(1, 4, 0);
    expect(column.settle()).toBe(false);
    expect(column.size).toBe(0);
  });

  it("drops pushes before its pivot, and past the horizon or at or below bandLow", () => {
    const column = newColumn(5);
    column.push(3, 10, 2);
    column.push(3, 12, 1);
    column.push(4, 1, 1);
    expect(column.settle()).toBe(true);
    expect([column.pivotF, column.pivotKey]).toEqual([3, 10]);
    // Before the pivot (a smaller f, or the same f and a smaller key): dropped.
    column.push(2, 50, 1);
    column.push(3, 9, 1);
    // At the pivot and after it: kept.
    column.push(3, 10, 3);
    column.push(3, 11, 4);
    expect(column.size).toBe(5);
    column.horizon = 6;
    column.bandLow = 4;
    expect(column.deferred).toBe(true);
    column.push(7, 2, 1); // past the horizon
    column.push(4, 3, 1); // at bandLow
    column.push(5, 3, 1); // in the band
    column.push(6, 4, 1); // at the horizon
    expect(column.size).toBe(7);
    column.bandLow = Number.NEGATIVE_INFINITY;
    const out = new ReducedEntries(new ByteLedger(undefined));
    expect(column.settle()).toBe(true);
    expect([column.pivotKey, column.pivotCoef]).toEqual([11, 4]); // 10 cancelled: 2 + 3 ≡ 0 (mod 5)
    expect(column.drainInto(out, 100, Number.NEGATIVE_INFINITY)).toBe(6);
    expect(stored(out, 0, out.used)).toEqual([
      { f: 3, key: 11, coef: 4 },
      { f: 3, key: 12, coef: 1 },
      { f: 4, key: 1, coef: 1 },
      { f: 5, key: 3, coef: 1 },
      { f: 6, key: 4, coef: 1 },
    ]);
    column.horizon = Number.POSITIVE_INFINITY;
    expect(column.deferred).toBe(false);
  });

  it("forgets the floor, the horizon, the band and the prime on reset", () => {
    const column = newColumn(2);
    column.push(5, 5, 1);
    expect(column.settle()).toBe(true);
    column.horizon = 8;
    column.bandLow = 6;
    column.reset(3);
    expect(column.size).toBe(0);
    expect(column.deferred).toBe(false);
    expect(column.floor).toBe(Number.NEGATIVE_INFINITY);
    column.push(1, 1, 1); // before the old floor and below the old band
    column.push(9, 2, 1); // past the old horizon
    column.push(9, 2, 1); // 2 over Z/3, 0 over Z/2
    expect(column.settle()).toBe(true);
    expect([column.pivotKey, column.pivotCoef]).toEqual([1, 1]);
    const out = new ReducedEntries(new ByteLedger(undefined));
    column.drainInto(out, 100, Number.NEGATIVE_INFINITY);
    expect(stored(out, 0, out.used)).toEqual([
      { f: 1, key: 1, coef: 1 },
      { f: 9, key: 2, coef: 2 },
    ]);
  });

  it("gives its heap's bytes back to the ledger on dispose", () => {
    const ledger = new ByteLedger(undefined);
    const column = new LazyColumn(ledger, 4);
    expect(ledger.held).toBe(4 * 20); // 20 bytes per heap entry (f64 f, f64 key, i32 coefficient)
    column.dispose();
    expect(ledger.held).toBe(0);
  });

  it("records the largest heap size seen when settling", () => {
    const column = newColumn(2);
    for (let k = 0; k < 9; k++) column.push(k, k, 1);
    expect(column.peak).toBe(0);
    column.settle();
    expect(column.peak).toBe(9);
    column.reset(2);
    column.push(1, 1, 1);
    column.settle();
    expect(column.peak).toBe(9);
  });

  it("adds stored columns read through cursors, as if their entries had been pushed", () => {
    for (const p of [2, 3, 5]) {
      for (let seed = 1; seed <= 12; seed++) {
        const next = lcg(seed * 104729 + p);
        const store = new ReducedEntries(new ByteLedger(undefined));
        // Past 64 cursors in some cases.
        const { added, ranges } = randomStoredColumns(next, store, 1 + (next() % 90), p);
        const pushed = randomEntries(next, next() % 30, 40, p);
        const exhausted: number[] = [];
        const column = newColumn(p);
        column.attach(store, (cursor) => exhausted.push(cursor));
        for (const e of pushed) column.push(e.f, e.key, e.coef);
        for (const [from, to, factor] of ranges) column.addStored(from, to, factor);
        const expected = tally([...pushed, ...added], p);
        expectSettlesAndDrains(column, store, expected);
        // Every cursor ran out once; an empty column's cursor at once.
        expect([...exhausted].sort((a, b) => a - b)).toEqual(ranges.map((_, i) => i));
      }
    }
  });

  it("with producers pushing band by band behind markers, is the column of everything pushed at once", () => {
    // Each source's entries are cut into bands at random values; a band is pushed when the marker after
    // the previous band comes up. Same pivot, and the same entries when drained, as the whole sum.
    for (const p of [2, 3, 5]) {
      for (let seed = 1; seed <= 30; seed++) {
        const next = lcg(seed * 6007 + p);
        const store = new ReducedEntries(new ByteLedger(undefined));
        // Without cursors for odd seeds.
        const { added, ranges } = randomStoredColumns(next, store, seed % 2 === 0 ? 1 + (next() % 6) : 0, p);
        const sources: Entry[][] = [];
        for (let k = 0; k < 1 + (next() % 5); k++) sources.push(randomEntries(next, next() % 25, 40, p));
        // Band ends of each source, increasing; the last band is unbounded.
        const cuts = sources.map(() => [0.5, 1.5, 2.5, 3.5].filter(() => next() % 2 === 0));
        const done = sources.map(() => 0);
        const column = newColumn(p);
        const pushBand = (k: number): void => {
          const low = done[k] === 0 ? Number.NEGATIVE_INFINITY : cuts[k][done[k] - 1];
          const high = done[k] < cuts[k].length ? cuts[k][done[k]] : Number.POSITIVE_INFINITY;
          for (const e of sources[k]) if (e.f > low && e.f <= high) column.push(e.f, e.key, e.coef);
          if (high !== Number.POSITIVE_INFINITY) column.pushMarker(high, k);
          done[k]++;
        };
        column.attach(store, () => {}, pushBand);
        for (let k = 0; k < sources.length; k++) pushBand(k);
        for (const [from, to, factor] of ranges) column.addStored(from, to, factor);
        const expected = tally([...sources.flat(), ...added], p);
        expectSettlesAndDrains(column, store, expected);
        // Every band was asked for, each once.
        expect(done).toEqual(cuts.map((c) => c.length + 1));
      }
    }
  });

  it("asks for a marker's band before any entry past its value is popped", () => {
    const column = newColumn(2);
    column.attach(
      new ReducedEntries(new ByteLedger(undefined)),
      () => {},
      (id) => {
        // The next band holds the column's earliest entry: it must come up before the one at 3.
        expect(id).toBe(7);
        column.push(2, 11, 1);
      },
    );
    column.push(3, 5, 1);
    column.pushMarker(1, 7);
    expect(column.settle()).toBe(true);
    expect([column.pivotF, column.pivotKey]).toEqual([2, 11]);
  });

  it("with cursors, asks for a marker's band only once the search has got past its value", () => {
    // A stored column (1, key 1), (3, key 2) read through a cursor; markers after the values 1 and 3.
    // Worked by hand: settling stops at (1, 1), before either marker's value is passed; draining asks for
    // marker 0 after the entry at 1 and before the one at 3, and for marker 1 after the entry at 3.
    const store = new ReducedEntries(new ByteLedger(undefined));
    storeColumn(
      store,
      0,
      [
        { f: 1, key: 1, coef: 1 },
        { f: 3, key: 2, coef: 1 },
      ],
      Number.POSITIVE_INFINITY,
    );
    const from = store.used;
    const asked: [number, number][] = [];
    const column = newColumn(2);
    column.attach(
      store,
      () => {},
      (id) => asked.push([id, store.used - from]),
    );
    column.pushMarker(1, 0);
    column.pushMarker(3, 1);
    column.addStored(0, 2, 1);
    expect(column.settle()).toBe(true);
    expect([column.pivotF, column.pivotKey]).toEqual([1, 1]);
    expect(asked).toEqual([]);
    expect(column.drainInto(store, 1e9, Number.NEGATIVE_INFINITY)).toBe(Number.POSITIVE_INFINITY);
    expect(stored(store, from, store.used)).toEqual([
      { f: 1, key: 1, coef: 1 },
      { f: 3, key: 2, coef: 1 },
    ]);
    // [marker, entries drained when it was asked for]
    expect(asked).toEqual([
      [0, 1],
      [1, 2],
    ]);
  });

  it("at the cap, goes on through the cursors' entries at the last value once the heap is empty", () => {
    // The heap's one entry (0.5, key 9) is drained first and leaves the heap empty; the cursor's three
    // entries at 1 must all be drained before the cover can be 1. Here they end the column: the cover
    // is the horizon (worked by hand).
    const store = new ReducedEntries(new ByteLedger(undefined));
    storeColumn(
      store,
      0,
      [1, 2, 3].map((key) => ({ f: 1, key, coef: 1 })),
      Number.POSITIVE_INFINITY,
    );
    const column = newColumn(2);
    column.attach(store, () => {});
    column.push(0.5, 9, 1);
    column.addStored(0, 3, 1);
    expect(column.settle()).toBe(true);
    const from = store.used;
    expect(column.drainInto(store, 2, Number.NEGATIVE_INFINITY)).toBe(Number.POSITIVE_INFINITY);
    expect(stored(store, from, store.used)).toEqual([
      { f: 0.5, key: 9, coef: 1 },
      { f: 1, key: 1, coef: 1 },
      { f: 1, key: 2, coef: 1 },
      { f: 1, key: 3, coef: 1 },
    ]);
  });

  it("at the cap, is complete up to the horizon when the rest lies past it, or when nothing is left", () => {
    // Worked by hand. A cursor's next entry at 5 lies past the horizon 3: the two entries drained are
    // every entry up to 3.
    const store = new ReducedEntries(new ByteLedger(undefined));
    storeColumn(
      store,
      0,
      [
        { f: 1, key: 1, coef: 1 },
        { f: 2, key: 2, coef: 1 },
        { f: 5, key: 3, coef: 1 },
      ],
      Number.POSITIVE_INFINITY,
    );
    const column = newColumn(2);
    column.attach(store, () => {});
    column.horizon = 3;
    column.addStored(0, 3, 1);
    expect(column.settle()).toBe(true);
    let from = store.used;
    expect(column.drainInto(store, 2, Number.NEGATIVE_INFINITY)).toBe(3);
    expect(stored(store, from, store.used)).toEqual([
      { f: 1, key: 1, coef: 1 },
      { f: 2, key: 2, coef: 1 },
    ]);
    // No horizon: a column whose last entry is the cap-th ran out, so it is complete up to +∞.
    column.reset(2);
    for (const f of [1, 2, 3]) column.push(f, f, 1);
    expect(column.settle()).toBe(true);
    from = store.used;
    expect(column.drainInto(store, 3, Number.NEGATIVE_INFINITY)).toBe(Number.POSITIVE_INFINITY);
    expect(stored(store, from, store.used).map((e) => e.f)).toEqual([1, 2, 3]);
  });

  it("tells at once when a stored column added has no entries, and reads the others in order", () => {
    const store = new ReducedEntries(new ByteLedger(undefined));
    storeColumn(store, 0, [], 1);
    storeColumn(
      store,
      1,
      [
        { f: 1, key: 3, coef: 1 },
        { f: 2, key: 0, coef: 2 },
      ],
      Number.POSITIVE_INFINITY,
    );
    const exhausted: number[] = [];
    const column = newColumn(3);
    column.attach(store, (cursor) => exhausted.push(cursor));
    column.addStored(store.start[0], store.start[0] + store.length[0], 1);
    expect(exhausted).toEqual([0]);
    column.addStored(store.start[1], store.start[1] + store.length[1], 2);
    expect(exhausted).toEqual([0]);
    expect(column.settle()).toBe(true);
    expect([column.pivotF, column.pivotKey, column.pivotCoef]).toEqual([1, 3, 2]);
    expect(exhausted).toEqual([0]); // the second entry is still to be read
    const from = store.used;
    column.drainInto(store, 100, Number.NEGATIVE_INFINITY);
    expect(exhausted).toEqual([0, 1]);
    expect(stored(store, from, store.used)).toEqual([
      { f: 1, key: 3, coef: 2 },
      { f: 2, key: 0, coef: 1 },
    ]);
  });

  it("is zero when the stored columns added cancel, and stops at a cap before the cursors' next value", () => {
    const store = new ReducedEntries(new ByteLedger(undefined));
    const own = [1, 2, 3].map((f) => ({ f, key: f, coef: 1 }));
    storeColumn(store, 0, own, Number.POSITIVE_INFINITY);
    const column = newColumn(3);
    column.attach(store, () => {});
    column.addStored(0, 3, 1);
    column.addStored(0, 3, 2); // 1 + 2 ≡ 0 (mod 3) for every entry
    expect(column.settle()).toBe(false);
    column.reset(3);
    column.addStored(0, 3, 1);
    const from = store.used;
    // The heap is empty, a cursor is left at f = 2: the entries are complete up to 1 only.
    expect(column.drainInto(store, 1, Number.NEGATIVE_INFINITY)).toBe(1);
    expect(stored(store, from, store.used)).toEqual([{ f: 1, key: 1, coef: 1 }]);
  });

  it("reads stored entries only up to the horizon", () => {
    const store = new ReducedEntries(new ByteLedger(undefined));
    const own = [1, 2, 3, 4, 5, 6].map((f) => ({ f, key: 10 - f, coef: 1 }));
    storeColumn(store, 0, own, Number.POSITIVE_INFINITY);
    const exhausted: number[] = [];
    const column = newColumn(2);
    column.attach(store, (cursor) => exhausted.push(cursor));
    column.horizon = 3;
    column.push(2, 100, 1);
    column.addStored(0, own.length, 1);
    const from = store.used;
    expect(column.drainInto(store, 100, Number.NEGATIVE_INFINITY)).toBe(3);
    expect(stored(store, from, store.used)).toEqual([
      { f: 1, key: 9, coef: 1 },
      { f: 2, key: 8, coef: 1 },
      { f: 2, key: 100, coef: 1 },
      { f: 3, key: 7, coef: 1 },
    ]);
    expect(exhausted).toEqual([]);
  });

  it("drains at most about `cap` entries, stopping where the value changes, and the rest stays", () => {
    for (let seed = 1; seed <= 15; seed++) {
      const next = lcg(seed * 15485863);
      const p = 3;
      const store = new ReducedEntries(new ByteLedger(undefined));
      const own = tally(randomEntries(next, 30, 40, p), p);
      storeColumn(store, 0, own, Number.POSITIVE_INFINITY);
      const pushed = randomEntries(next, 40, 40, p);
      const expected = tally([...pushed, ...own], p);
      const column = newColumn(p);
      column.attach(store, () => {});
      for (const e of pushed) column.push(e.f, e.key, e.coef);
      column.addStored(0, own.length, 1);
      const cap = 1 + (next() % 12);
      const from = store.used;
      const cover = column.drainInto(store, cap, Number.NEGATIVE_INFINITY);
      const first = stored(store, from, store.used);
      // Everything up to the cover, nothing past it; at least cap entries unless the column ran out.
      expect(first).toEqual(expected.filter((e) => e.f <= cover));
      expect(column.drained).toBe(first.length);
      if (cover === Number.POSITIVE_INFINITY) expect(first.length).toBe(expected.length);
      else expect(first.length).toBeGreaterThanOrEqual(cap);
      if (first.length > cap) expect(first[first.length - 1].f).toBe(first[cap - 1].f);
      const rest = store.used;
      expect(column.drainInto(store, 1e9, cover)).toBe(Number.POSITIVE_INFINITY);
      expect(stored(store, rest, store.used)).toEqual(expected.filter((e) => e.f > cover));
    }
  });

  it("with cap 0 gives back the cover it was told when the next value differs, and the horizon when empty", () => {
    const out = new ReducedEntries(new ByteLedger(undefined));
    const column = newColumn(2);
    column.horizon = 9;
    expect(column.drainInto(out, 0, 1)).toBe(9);
    column.push(2, 1, 1);
    expect(column.drainInto(out, 0, 1)).toBe(1);
    expect(out.used).toBe(0);
    expect(column.drainInto(out, 0, 2)).toBe(9); // the next value is the cover itself: it goes on
    expect(stored(out, 0, out.used)).toEqual([{ f: 2, key: 1, coef: 1 }]);
    column.push(9, 3, 1); // at the horizon: not complete until drained
    expect(column.drainInto(out, 0, 1)).toBe(1);
    expect(column.size).toBe(1);
  });

  it("forgets its cursors on reset, and numbers the next ones from 0 again", () => {
    const store = new ReducedEntries(new ByteLedger(undefined));
    storeColumn(
      store,
      0,
      [
        { f: 1, key: 1, coef: 1 },
        { f: 2, key: 2, coef: 1 },
      ],
      Number.POSITIVE_INFINITY,
    );
    const exhausted: number[] = [];
    const column = newColumn(2);
    column.attach(store, (cursor) => exhausted.push(cursor));
    column.addStored(0, 2, 1);
    column.addStored(0, 2, 1);
    column.addStored(0, 1, 1);
    expect(column.settle()).toBe(true); // key 1 three times: 1 (mod 2); two cursors are left at key 2
    column.reset(3);
    expect(column.settle()).toBe(false);
    exhausted.length = 0;
    column.addStored(1, 2, 1);
    expect(column.settle()).toBe(true);
    expect([column.pivotF, column.pivotKey]).toEqual([2, 2]);
    expect(exhausted).toEqual([0]);
  });

  it("stops with the entries of complete values when the store runs out of room", () => {
    // 40,000 bytes keep at most 500 stored entries (a quarter of the budget, 20 bytes each).
    const out = new ReducedEntries(new ByteLedger({ maxBytes: 40_000 }));
    const column = newColumn(2);
    const expected: Entry[] = [];
    for (let key = 0; key < 700; key++) {
      const f = Math.floor(key / 3);
      column.push(f, key, 1);
      expected.push({ f, key, coef: 1 });
    }
    // Entry 501 (key 500, f 166) finds no room: the entries at f = 166 (keys 498, 499) are dropped too.
    expect(column.drainInto(out, 1e9, Number.NEGATIVE_INFINITY)).toBe(165);
    expect(out.used).toBe(498);
    expect(column.drained).toBe(498);
    expect(stored(out, 0, out.used)).toEqual(expected.slice(0, 498));
  });

  it("reads on where its producer continues an exhausted cursor, while the store moves, drained apart", () => {
    // Each stored column is cut into parts at random values; the store holds only the first part, and a
    // cursor that runs out is continued with the next part, appended then after 1,500 unrelated entries
    // (so the store's arrays are replaced while the column is being popped). Some first parts are empty.
    for (const p of [2, 3, 5]) {
      for (let seed = 1; seed <= 20; seed++) {
        const next = lcg(seed * 7919 + p);
        const store = new ReducedEntries(new ByteLedger(undefined));
        const column = newColumn(p);
        const parts: Entry[][][] = [];
        const factors: number[] = [];
        const expected: Entry[] = randomEntries(next, next() % 20, 40, p);
        for (const e of expected) column.push(e.f, e.key, e.coef);
        const count = 1 + (next() % 70);
        for (let c = 0; c < count; c++) {
          const own = tally(randomEntries(next, next() % 12, 40, p), p);
          const cuts = [0.5, 1.5, 2.5, 3.5].filter(() => next() % 2 === 0);
          const bounds = [Number.NEGATIVE_INFINITY, ...cuts, Number.POSITIVE_INFINITY];
          parts.push(bounds.slice(1).map((high, i) => own.filter((e) => e.f > bounds[i] && e.f <= high)));
          factors.push(1 + (next() % (p - 1)));
          for (const e of own) expected.push({ ...e, coef: e.coef * factors[c] });
        }
        const read = parts.map(() => 0);
        column.attach(store, (cursor) => {
          // Like the reduction's producer, it passes over empty parts.
          let part = ++read[cursor];
          while (part < parts[cursor].length && parts[cursor][part].length === 0) part = ++read[cursor];
          if (part === parts[cursor].length) return;
          expect(store.reserveEntries(1500)).toBe(true);
          for (let k = 0; k < 1500; k++) store.append(-1, -1, 1);
          const from = store.used;
          storeColumn(store, 1000 + cursor, parts[cursor][part], 0);
          column.continueCursor(cursor, from, store.used);
        });
        for (let c = 0; c < count; c++) {
          const from = store.used;
          storeColumn(store, c, parts[c][0], 0);
          column.addStored(from, store.used, factors[c]);
        }
        expectSettlesAndDrains(column, new ReducedEntries(new ByteLedger(undefined)), tally(expected, p));
        // Every cursor read to its column's end.
        expect(read).toEqual(parts.map((part) => part.length));
      }
    }
  });
});

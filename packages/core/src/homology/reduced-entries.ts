import { grownFloat, grownInt } from "./grown-array.js";
import type { ByteLedger } from "./homology-budget.js";

const ENTRY_BYTES = 20; // f (f64), key (f64), coefficient (i32)
const COLUMN_BYTES = 20; // start, length (i32), cover (f64), spare

/**
 * Sorted reduced entries of finished columns with long chains: the column's entries from its pivot on, in
 * filtration order, complete up to `cover[id]` (entries after it are regenerated from the chain). Adding
 * such a column then reads its entries one by one, only as far as the working column's pivot search goes,
 * instead of regenerating the coboundary of every simplex of its chain.
 */
export class ReducedEntries {
  start: Int32Array;
  length: Int32Array;
  /** Entries with f ≤ cover are stored; -Infinity: the column has none stored. */
  cover: Float64Array;
  entryF: Float64Array;
  entryKey: Float64Array;
  entryCoef: Int32Array;
  used = 0;
  private readonly ledger: ByteLedger;
  /** Stored entries stop here: storing more would crowd out the rest of the computation. */
  private readonly maxEntries: number;

  constructor(ledger: ByteLedger) {
    this.ledger = ledger;
    this.maxEntries = Math.floor(ledger.maxBytes / 4 / ENTRY_BYTES);
    ledger.reserve(256 * COLUMN_BYTES + 1024 * ENTRY_BYTES, "storing reduced entries");
    this.start = new Int32Array(256);
    this.length = new Int32Array(256);
    this.cover = new Float64Array(256).fill(Number.NEGATIVE_INFINITY);
    this.entryF = new Float64Array(1024);
    this.entryKey = new Float64Array(1024);
    this.entryCoef = new Int32Array(1024);
  }

  has(id: number): boolean {
    return id < this.cover.length && this.cover[id] !== Number.NEGATIVE_INFINITY;
  }

  /**
   * Room for `count` more entries without passing the share of the budget kept for them, nor the budget
   * itself: stored entries only save time, so running short of room is never an error.
   */
  reserveEntries(count: number): boolean {
    if (this.used + count > this.maxEntries) return false;
    while (this.used + count > this.entryF.length) {
      const size = this.entryF.length * 2;
      const bytes = this.entryF.length * ENTRY_BYTES;
      if (this.ledger.held + bytes > this.ledger.maxBytes) return false;
      this.ledger.reserve(bytes, "storing reduced entries");
      this.entryF = grownFloat(this.entryF, size);
      this.entryKey = grownFloat(this.entryKey, size);
      this.entryCoef = grownInt(this.entryCoef, size);
    }
    return true;
  }

  /** Appends one entry (after reserveEntries made room). */
  append(f: number, key: number, coef: number): void {
    const at = this.used++;
    this.entryF[at] = f;
    this.entryKey[at] = key;
    this.entryCoef[at] = coef;
  }

  /** Marks the entries appended since `from` as column `id`'s, complete up to `cover`. */
  close(id: number, from: number, cover: number): void {
    while (id >= this.start.length) this.growColumns();
    this.start[id] = from;
    this.length[id] = this.used - from;
    this.cover[id] = cover;
  }

  dispose(): void {
    this.ledger.release(this.start.length * COLUMN_BYTES + this.entryF.length * ENTRY_BYTES);
  }

  private growColumns(): void {
    const size = this.start.length * 2;
    this.ledger.reserve(this.start.length * COLUMN_BYTES, "storing reduced entries");
    this.start = grownInt(this.start, size);
    this.length = grownInt(this.length, size);
    const cover = new Float64Array(size).fill(Number.NEGATIVE_INFINITY);
    cover.set(this.cover);
    this.cover = cover;
  }
}

import { grownFloat, grownInt } from "./grown-array.js";
import type { ByteLedger } from "./homology-budget.js";

const ENTRY_BYTES = 20; // f (f64), key (f64), coefficient (i32)
const COLUMN_BYTES = 24; // start, length, first and last segment (i32), cover (f64)
const SEGMENT_BYTES = 12; // start, length, next (i32)

/**
 * Sorted reduced entries of finished columns with long chains: the column's entries from its pivot on, in
 * filtration order, complete up to `cover[id]` (entries after it are regenerated from the chain). Adding
 * such a column then reads its entries one by one, only as far as the working column's pivot search goes,
 * instead of regenerating the coboundary of every simplex of its chain. A column read past its cover can
 * be extended: the entries of the next values are appended as a segment that continues it.
 */
export class ReducedEntries {
  start: Int32Array;
  length: Int32Array;
  /** Entries with f ≤ cover are stored; -Infinity: the column has none stored. */
  cover: Float64Array;
  /** The segment that continues the column's first entries; -1: none yet. */
  firstSegment: Int32Array;
  /** Segments of entries that extend columns, each with the one that continues it (-1: none yet). */
  segmentStart: Int32Array;
  segmentLength: Int32Array;
  segmentNext: Int32Array;
  segmentCount = 0;
  /** Each column's last segment (-1: its first entries). */
  private lastSegment: Int32Array;
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
    ledger.reserve(256 * COLUMN_BYTES + 256 * SEGMENT_BYTES + 1024 * ENTRY_BYTES, "storing reduced entries");
    this.start = new Int32Array(256);
    this.length = new Int32Array(256);
    this.cover = new Float64Array(256).fill(Number.NEGATIVE_INFINITY);
    this.firstSegment = new Int32Array(256);
    this.lastSegment = new Int32Array(256);
    this.segmentStart = new Int32Array(256);
    this.segmentLength = new Int32Array(256);
    this.segmentNext = new Int32Array(256);
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
    this.firstSegment[id] = -1;
    this.lastSegment[id] = -1;
  }

  /**
   * Appends every entry of `more` (all after column `id`'s cover, complete up to `cover`) as a segment that
   * continues the column. Returns the segment, or -1 (nothing changed) when there is no room for it.
   */
  extend(id: number, more: ReducedEntries, cover: number): number {
    if (!this.appendAll(more)) return -1;
    if (this.segmentCount === this.segmentStart.length) this.growSegments();
    const segment = this.segmentCount++;
    this.segmentStart[segment] = this.used - more.used;
    this.segmentLength[segment] = more.used;
    this.segmentNext[segment] = -1;
    const last = this.lastSegment[id];
    if (last < 0) this.firstSegment[id] = segment;
    else this.segmentNext[last] = segment;
    this.lastSegment[id] = segment;
    this.cover[id] = cover;
    return segment;
  }

  /** Appends every entry of `other` (false, and nothing appended, when there is no room). */
  appendAll(other: ReducedEntries): boolean {
    const count = other.used;
    if (!this.reserveEntries(count)) return false;
    const at = this.used;
    this.entryF.set(other.entryF.subarray(0, count), at);
    this.entryKey.set(other.entryKey.subarray(0, count), at);
    this.entryCoef.set(other.entryCoef.subarray(0, count), at);
    this.used += count;
    return true;
  }

  dispose(): void {
    this.ledger.release(
      this.start.length * COLUMN_BYTES +
        this.segmentStart.length * SEGMENT_BYTES +
        this.entryF.length * ENTRY_BYTES,
    );
  }

  private growSegments(): void {
    const size = this.segmentStart.length * 2;
    this.ledger.reserve(this.segmentStart.length * SEGMENT_BYTES, "storing reduced entries");
    this.segmentStart = grownInt(this.segmentStart, size);
    this.segmentLength = grownInt(this.segmentLength, size);
    this.segmentNext = grownInt(this.segmentNext, size);
  }

  private growColumns(): void {
    const size = this.start.length * 2;
    this.ledger.reserve(this.start.length * COLUMN_BYTES, "storing reduced entries");
    this.start = grownInt(this.start, size);
    this.length = grownInt(this.length, size);
    this.firstSegment = grownInt(this.firstSegment, size);
    this.lastSegment = grownInt(this.lastSegment, size);
    const cover = new Float64Array(size).fill(Number.NEGATIVE_INFINITY);
    cover.set(this.cover);
    this.cover = cover;
  }
}

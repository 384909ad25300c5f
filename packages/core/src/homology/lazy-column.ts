import { CofaceHeap } from "./coface-heap.js";
import type { CofaceSink } from "./coface-sink.js";
import { grownFloat, grownInt } from "./grown-array.js";
import type { ByteLedger } from "./homology-budget.js";
import type { ReducedEntries } from "./reduced-entries.js";

/**
 * The column being reduced in implicit matrix reduction: a binary min-heap of (f, key, coefficient) entries
 * filled from the cofaces of the chain simplices. Nothing is ever sorted or merged as a whole: settle() pops
 * only until the first key whose summed coefficient is not 0 mod p (the pivot), and puts that back so the
 * column stays complete. Equal keys are cancelled lazily when they reach the top.
 */
export class LazyColumn implements CofaceSink {
  pivotF = 0;
  pivotKey = -1;
  pivotCoef = 0;
  /** Largest heap size seen since construction. */
  peak = 0;
  private readonly heap: CofaceHeap;
  private p = 2;
  /**
   * Entries before (floorF, floorKey) are dropped on push. Once the pivot P is found, every entry before P
   * sums to zero in the column, and every column added to cancel P has P as its pivot too, so its entries
   * before P also sum to zero: they need never enter the heap.
   */
  private floorF = Number.NEGATIVE_INFINITY;
  private floorKey = 0;
  /**
   * Entries after `horizon` are not heaped (most entries of a long column are never reached by its pivot),
   * and producers may skip them before computing their keys; so the column is known to be zero only once
   * the horizon has been raised to +∞ and nothing is left. While the chain is pushed again for a raised
   * horizon, only entries after `bandLow` (the old horizon) are new.
   */
  horizon = Number.POSITIVE_INFINITY;
  bandLow = Number.NEGATIVE_INFINITY;

  /**
   * Stored reduced columns added to this one, read lazily: each cursor walks its column's sorted entries
   * (scaled by its factor) only as far as the pivot search goes. A min-heap of cursor ids by head entry.
   */
  private entries: ReducedEntries | null = null;
  private cursorPos: Int32Array = new Int32Array(64);
  private cursorEnd: Int32Array = new Int32Array(64);
  private cursorFactor: Int32Array = new Int32Array(64);
  private cursorHeap: Int32Array = new Int32Array(64);
  /** The head entry (f, key) of the cursor at each heap slot, so that sifts compare without indirection. */
  private headF: Float64Array = new Float64Array(64);
  private headKey: Float64Array = new Float64Array(64);
  private cursorCount = 0;
  private cursorsOpened = 0;

  constructor(ledger: ByteLedger, capacity = 1024) {
    this.heap = new CofaceHeap(ledger, capacity);
  }

  /**
   * Told when a cursor has given its last stored entry (its id is the order of addStored calls): it may
   * continue the cursor (continueCursor) or push the column's later entries itself.
   */
  private onExhausted: ((cursor: number) => void) | null = null;
  /** Told when a marker reaches the top: the column's entries up to the marker's value are all popped. */
  private onMarker: (id: number) => void = () => {};

  /**
   * Where the stored columns given to addStored keep their entries, who continues a cursor that has run
   * out or pushes its column's later entries, and who pushes the next band of a source whose marker
   * (pushMarker) came up.
   */
  attach(
    entries: ReducedEntries,
    onExhausted: (cursor: number) => void,
    onMarker: (id: number) => void = () => {},
  ): void {
    this.entries = entries;
    this.onExhausted = onExhausted;
    this.onMarker = onMarker;
  }

  /**
   * Puts a marker after every entry with value ≤ f: when the pivot search gets past f, onMarker(id) is
   * called (before any entry with a larger value is popped), so a producer can push its entries band by
   * band instead of up to the horizon at once. Not subject to the floor or the band; at most one
   * marker per id at a time.
   */
  pushMarker(f: number, id: number): void {
    this.heap.push(f, MARKER_KEY + 2 * id, 0);
  }

  /** Pops markers at the top of the heap that come before `beforeF` (the cursors' least value). */
  private popMarkers(beforeF: number): void {
    const heap = this.heap;
    while (heap.size > 0 && heap.key[0] >= MARKER_KEY && heap.f[0] < beforeF) {
      const id = (heap.key[0] - MARKER_KEY) / 2;
      heap.pop();
      this.onMarker(id);
    }
  }

  reset(p: number): void {
    this.p = p;
    this.heap.clear();
    this.floorF = Number.NEGATIVE_INFINITY;
    this.floorKey = 0;
    this.horizon = Number.POSITIVE_INFINITY;
    this.bandLow = Number.NEGATIVE_INFINITY;
    this.cursorCount = 0;
    this.cursorsOpened = 0;
  }

  /**
   * Adds factor × the stored entries [start, end) of a finished column (sorted, from its pivot on). The
   * caller pushes the column's entries past its stored cover itself.
   */
  addStored(start: number, end: number, factor: number): void {
    if (this.cursorsOpened === this.cursorPos.length) this.growCursors();
    const id = this.cursorsOpened++;
    this.cursorPos[id] = start;
    this.cursorEnd[id] = end;
    this.cursorFactor[id] = factor;
    if (start >= end) {
      (this.onExhausted as (cursor: number) => void)(id);
      if (this.cursorPos[id] >= this.cursorEnd[id]) return;
    }
    // Sift up.
    const entries = this.entries as ReducedEntries;
    const at = this.cursorPos[id];
    const f = entries.entryF[at];
    const key = entries.entryKey[at];
    const order = this.cursorHeap;
    const hf = this.headF;
    const hk = this.headKey;
    let i = this.cursorCount++;
    while (i > 0) {
      const parent = (i - 1) >> 1;
      const pf = hf[parent];
      if (pf < f || (pf === f && hk[parent] <= key)) break;
      order[i] = order[parent];
      hf[i] = pf;
      hk[i] = hk[parent];
      i = parent;
    }
    order[i] = id;
    hf[i] = f;
    hk[i] = key;
  }

  /**
   * Gives an exhausted cursor the stored entries [start, end) to read next (from within onExhausted, which
   * is told when it ran out). They must come after every entry it gave before.
   */
  continueCursor(id: number, start: number, end: number): void {
    this.cursorPos[id] = start;
    this.cursorEnd[id] = end;
  }

  push(f: number, key: number, coef: number): void {
    if (
      f > this.horizon ||
      f <= this.bandLow ||
      f < this.floorF ||
      (f === this.floorF && key < this.floorKey)
    )
      return;
    this.heap.push(f, key, coef);
  }

  /** Whether entries may lie past the horizon. */
  get deferred(): boolean {
    return this.horizon !== Number.POSITIVE_INFINITY;
  }

  /** Entries with f below this are dropped by push (those at it are compared by key). */
  get floor(): number {
    return this.floorF;
  }

  get size(): number {
    return this.heap.size;
  }

  /** Finds the pivot (leaving it in the column). False when the column is 0 (then the heap is empty). */
  settle(): boolean {
    const heap = this.heap;
    const p = this.p;
    if (heap.size > this.peak) this.peak = heap.size;
    if (this.cursorCount > 0) return this.settleWithCursors();
    while (heap.size > 0) {
      const f = heap.f[0];
      const key = heap.key[0];
      if (key >= MARKER_KEY) {
        this.popMarkers(Number.POSITIVE_INFINITY);
        continue;
      }
      const sum = heap.popMerged() % p;
      if (sum !== 0) {
        this.pivotF = f;
        this.pivotKey = key;
        this.pivotCoef = sum;
        this.floorF = f;
        this.floorKey = key;
        heap.push(f, key, sum);
        return true;
      }
    }
    return false;
  }

  /** Pops the least entry of heap and cursors (up to the horizon), merged; NaN key when none is left. */
  private popLeast(): number {
    const heap = this.heap;
    const entries = this.entries as ReducedEntries;
    const order = this.cursorHeap;
    let hasCursor = false;
    let cf = 0;
    let ck = 0;
    if (this.cursorCount > 0) {
      cf = this.headF[0];
      ck = this.headKey[0];
      hasCursor = cf <= this.horizon;
    }
    // A marker's producer may push entries before the cursors' head (and may exhaust no cursor).
    this.popMarkers(hasCursor ? cf : Number.POSITIVE_INFINITY);
    const hasHeap = heap.size > 0;
    if (!hasHeap && !hasCursor) {
      this.leastKey = Number.NaN;
      return 0;
    }
    let f: number;
    let key: number;
    if (hasHeap && (!hasCursor || heap.f[0] < cf || (heap.f[0] === cf && heap.key[0] <= ck))) {
      f = heap.f[0];
      key = heap.key[0];
    } else {
      f = cf;
      key = ck;
    }
    let sum = 0;
    if (hasHeap && heap.key[0] === key) sum += heap.popMerged();
    while (this.cursorCount > 0 && this.headKey[0] === key) {
      const id = order[0];
      sum += this.cursorFactor[id] * entries.entryCoef[this.cursorPos[id]];
      // May move the store's arrays: an exhausted cursor's producer can append entries to it.
      this.advanceTopCursor();
    }
    this.leastF = f;
    this.leastKey = key;
    return sum % this.p;
  }

  private leastF = 0;
  private leastKey = 0;

  private settleWithCursors(): boolean {
    for (;;) {
      const sum = this.popLeast();
      if (Number.isNaN(this.leastKey)) return false;
      if (sum !== 0) {
        const f = this.leastF;
        const key = this.leastKey;
        this.pivotF = f;
        this.pivotKey = key;
        this.pivotCoef = sum;
        this.floorF = f;
        this.floorKey = key;
        this.heap.push(f, key, sum);
        return true;
      }
    }
  }

  /** Entries appended by the last drainInto. */
  drained = 0;

  /**
   * Appends the column's nonzero entries in filtration order (from the pivot, which settle() left in it)
   * to `out`, consuming the column up to the horizon, until `cap` entries are out and the next value
   * differs from the last. `coveredTo`: the value up to which earlier calls stored every entry. Returns
   * the value up to which the entries appended are complete (the horizon when the column ran out).
   */
  drainInto(out: ReducedEntries, cap: number, coveredTo: number): number {
    let lastF = coveredTo;
    let beforeLastF = coveredTo;
    let runStart = out.used;
    let count = 0;
    this.drained = 0;
    for (;;) {
      if (count >= cap) {
        // Stop at a change of value, so every entry up to the cover is stored.
        let nextF = Number.POSITIVE_INFINITY;
        if (this.heap.size > 0) nextF = this.heap.f[0];
        if (this.cursorCount > 0) {
          const cf = this.headF[0];
          if (cf < nextF) nextF = cf;
        }
        if (nextF > this.horizon || (this.heap.size === 0 && this.cursorCount === 0)) return this.horizon;
        if (nextF !== lastF) return lastF;
      }
      const sum = this.cursorCount > 0 ? this.popLeast() : this.popHeapOnly();
      if (Number.isNaN(this.leastKey)) return this.horizon;
      if (sum === 0) continue;
      const f = this.leastF;
      if (f !== lastF) {
        beforeLastF = lastF;
        lastF = f;
        runStart = out.used;
      }
      if (!out.reserveEntries(1)) {
        // Out of room: drop the entries at the last value, which may be incomplete.
        this.drained -= out.used - runStart;
        out.used = runStart;
        return beforeLastF;
      }
      out.append(f, this.leastKey, sum);
      count++;
      this.drained++;
    }
  }

  private popHeapOnly(): number {
    const heap = this.heap;
    this.popMarkers(Number.POSITIVE_INFINITY);
    if (heap.size === 0) {
      this.leastKey = Number.NaN;
      return 0;
    }
    this.leastF = heap.f[0];
    this.leastKey = heap.key[0];
    return heap.popMerged() % this.p;
  }

  private advanceTopCursor(): void {
    const order = this.cursorHeap;
    let top = order[0];
    let f: number;
    let key: number;
    const pos = ++this.cursorPos[top];
    // The producer may give the cursor more entries (continueCursor) or push the rest of its column
    // (entries past the cover, after every entry popped so far).
    if (pos >= this.cursorEnd[top]) (this.onExhausted as (cursor: number) => void)(top);
    const hf = this.headF;
    const hk = this.headKey;
    if (this.cursorPos[top] < this.cursorEnd[top]) {
      // Read after the producer, which may have moved the store's arrays.
      const entries = this.entries as ReducedEntries;
      f = entries.entryF[this.cursorPos[top]];
      key = entries.entryKey[this.cursorPos[top]];
    } else {
      const last = --this.cursorCount;
      if (last === 0) return;
      top = order[last];
      f = hf[last];
      key = hk[last];
    }
    // Sift down.
    const count = this.cursorCount;
    let i = 0;
    for (;;) {
      let child = 2 * i + 1;
      if (child >= count) break;
      const right = child + 1;
      if (right < count && (hf[right] < hf[child] || (hf[right] === hf[child] && hk[right] < hk[child])))
        child = right;
      const cf = hf[child];
      if (f < cf || (f === cf && key <= hk[child])) break;
      order[i] = order[child];
      hf[i] = cf;
      hk[i] = hk[child];
      i = child;
    }
    order[i] = top;
    hf[i] = f;
    hk[i] = key;
  }

  private growCursors(): void {
    const size = this.cursorPos.length * 2;
    this.cursorPos = grownInt(this.cursorPos, size);
    this.cursorEnd = grownInt(this.cursorEnd, size);
    this.cursorFactor = grownInt(this.cursorFactor, size);
    this.cursorHeap = grownInt(this.cursorHeap, size);
    this.headF = grownFloat(this.headF, size);
    this.headKey = grownFloat(this.headKey, size);
  }

  dispose(): void {
    this.heap.dispose();
  }
}

/**
 * Keys of markers (pushMarker): past every simplex key (the binomial tables stay below 2^53), so a marker
 * comes after every entry of its value; steps of 2 keep them exact doubles.
 */
const MARKER_KEY = 2 ** 53;

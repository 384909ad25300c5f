import { CofaceHeap } from "./coface-heap.js";
import type { CofaceSink } from "./coface-sink.js";
import type { ByteLedger } from "./homology-budget.js";

/**
 * The column being reduced. Reduced columns of graphs whose weights have little geometry grow long (10⁵
 * entries) and take hundreds of additions of much shorter columns, so the column is kept in two parts: a
 * sorted, merged run (filtration order, no zeros) and a heap of pending additions. Additions go into the
 * heap (cost: the added entries only); when the heap grows past half the run, it is drained and merged into
 * the run in one linear pass. The pivot is the smallest entry of both, with equal keys summed mod p.
 */
export class WorkingColumn implements CofaceSink {
  /** The current pivot, valid after settle() returned true. */
  pivotF = 0;
  pivotKey = -1;
  pivotCoef = 0;
  private hasPivot = false;
  private runF: Float64Array;
  private runKey: Float64Array;
  private runCoef: Int32Array;
  private head = 0;
  private end = 0;
  private spareF: Float64Array;
  private spareKey: Float64Array;
  private spareCoef: Int32Array;
  private readonly pending: CofaceHeap;
  private readonly ledger: ByteLedger;
  private p = 2;

  constructor(ledger: ByteLedger, capacity = 1024) {
    this.ledger = ledger;
    ledger.reserve(capacity * 40, "growing the working column");
    this.runF = new Float64Array(capacity);
    this.runKey = new Float64Array(capacity);
    this.runCoef = new Int32Array(capacity);
    this.spareF = new Float64Array(capacity);
    this.spareKey = new Float64Array(capacity);
    this.spareCoef = new Int32Array(capacity);
    this.pending = new CofaceHeap(ledger);
  }

  reset(p: number): void {
    this.p = p;
    this.head = 0;
    this.end = 0;
    this.hasPivot = false;
    this.pending.clear();
  }

  push(f: number, key: number, coef: number): void {
    this.pending.push(f, key, coef);
  }

  /** Closes a coboundary pushed entry by entry (merging the pending entries in when they grew large). */
  commit(): void {
    this.flushIfLarge();
  }

  /** Upper bound on the number of entries. */
  get sizeBound(): number {
    return this.end - this.head + this.pending.size + (this.hasPivot ? 1 : 0);
  }

  /** this += factor · other[from .. to) (entries sorted or not). */
  addSorted(
    f: Float64Array,
    key: Float64Array,
    coef: Int32Array,
    from: number,
    to: number,
    factor: number,
  ): void {
    const p = this.p;
    for (let e = from; e < to; e++) this.pending.push(f[e], key[e], (factor * coef[e]) % p);
    this.flushIfLarge();
  }

  private flushIfLarge(): void {
    if (this.pending.size > 4096 && this.pending.size * 2 > this.end - this.head) this.flush();
  }

  /** Finds the pivot: the first entry whose summed coefficient is not 0 mod p. False when the column is 0. */
  settle(): boolean {
    const p = this.p;
    const heap = this.pending;
    for (;;) {
      const inRun = this.head < this.end;
      const inHeap = heap.size > 0;
      if (!this.hasPivot && !inRun && !inHeap) return false;
      // Smallest key among the held pivot, the run's first entry and the heap's top.
      let f = Infinity;
      let key = Infinity;
      if (this.hasPivot) {
        f = this.pivotF;
        key = this.pivotKey;
      }
      if (inRun) {
        const rf = this.runF[this.head];
        const rk = this.runKey[this.head];
        if (rf < f || (rf === f && rk < key)) {
          f = rf;
          key = rk;
        }
      }
      if (inHeap) {
        const hf = heap.f[0];
        const hk = heap.key[0];
        if (hf < f || (hf === f && hk < key)) {
          f = hf;
          key = hk;
        }
      }
      let sum = 0;
      if (this.hasPivot && this.pivotKey === key) {
        sum += this.pivotCoef;
        this.hasPivot = false;
      }
      if (inRun && this.runKey[this.head] === key) sum += this.runCoef[this.head++];
      if (inHeap && heap.key[0] === key) sum += heap.popMerged();
      sum %= p;
      if (sum !== 0) {
        if (this.hasPivot) throw new Error("internal: working column pivot out of order");
        this.hasPivot = true;
        this.pivotF = f;
        this.pivotKey = key;
        this.pivotCoef = sum;
        return true;
      }
    }
  }

  /**
   * Hands every entry, pivot first and in filtration order, to `out` (the column is consumed). Call after
   * settle() returned true.
   */
  drain(out: (f: number, key: number, coef: number) => void): void {
    while (this.settle()) {
      out(this.pivotF, this.pivotKey, this.pivotCoef);
      this.hasPivot = false;
    }
  }

  dispose(): void {
    this.ledger.release(this.runF.length * 40);
    this.pending.dispose();
  }

  /** Merges the heap, drained in order, into the run. */
  private flush(): void {
    const heap = this.pending;
    const p = this.p;
    const needed = this.end - this.head + heap.size;
    if (needed > this.spareF.length) this.grow(needed);
    const rf = this.runF;
    const rk = this.runKey;
    const rc = this.runCoef;
    const of = this.spareF;
    const ok = this.spareKey;
    const oc = this.spareCoef;
    let i = this.head;
    const end = this.end;
    let m = 0;
    while (heap.size > 0) {
      const hf = heap.f[0];
      const hk = heap.key[0];
      // Copy run entries that come first.
      while (i < end && (rf[i] < hf || (rf[i] === hf && rk[i] < hk))) {
        of[m] = rf[i];
        ok[m] = rk[i];
        oc[m] = rc[i];
        m++;
        i++;
      }
      let sum = heap.popMerged();
      if (i < end && rk[i] === hk) sum += rc[i++];
      sum %= p;
      if (sum !== 0) {
        of[m] = hf;
        ok[m] = hk;
        oc[m] = sum;
        m++;
      }
    }
    while (i < end) {
      of[m] = rf[i];
      ok[m] = rk[i];
      oc[m] = rc[i];
      m++;
      i++;
    }
    this.spareF = rf;
    this.spareKey = rk;
    this.spareCoef = rc;
    this.runF = of;
    this.runKey = ok;
    this.runCoef = oc;
    this.head = 0;
    this.end = m;
  }

  private grow(needed: number): void {
    let capacity = this.runF.length;
    while (capacity < needed) capacity *= 2;
    this.ledger.reserve((capacity - this.runF.length) * 40, "growing the working column");
    const f = new Float64Array(capacity);
    f.set(this.runF.subarray(this.head, this.end));
    const key = new Float64Array(capacity);
    key.set(this.runKey.subarray(this.head, this.end));
    const coef = new Int32Array(capacity);
    coef.set(this.runCoef.subarray(this.head, this.end));
    this.end -= this.head;
    this.head = 0;
    this.runF = f;
    this.runKey = key;
    this.runCoef = coef;
    this.spareF = new Float64Array(capacity);
    this.spareKey = new Float64Array(capacity);
    this.spareCoef = new Int32Array(capacity);
  }
}

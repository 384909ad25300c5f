import { CofaceHeap } from "./coface-heap.js";
import type { CofaceSink } from "./coface-sink.js";
import type { ByteLedger } from "./homology-budget.js";

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

  constructor(ledger: ByteLedger, capacity = 1024) {
    this.heap = new CofaceHeap(ledger, capacity);
  }

  reset(p: number): void {
    this.p = p;
    this.heap.clear();
    this.floorF = Number.NEGATIVE_INFINITY;
    this.floorKey = 0;
    this.horizon = Number.POSITIVE_INFINITY;
    this.bandLow = Number.NEGATIVE_INFINITY;
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
    while (heap.size > 0) {
      const f = heap.f[0];
      const key = heap.key[0];
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

  dispose(): void {
    this.heap.dispose();
  }
}

import type { ByteLedger } from "./homology-budget.js";

/** Thresholds whose sets are kept at once: a sweep uses two, and the extensions interleave with it. */
const SLOTS = 4;

/**
 * For the last few thresholds t asked, the set of each vertex u's neighbours v with edge value ≤ t, as a
 * bitset over v (32 vertices a word). A vertex's set is built from its sorted row the first time it is
 * asked for a threshold and kept while the threshold stays among the last SLOTS asked: the dense triangle
 * sweeps intersect three of them and visit only the cofaces they push, instead of scanning a row.
 */
export class ThresholdBits {
  /** Words per vertex. */
  readonly words: number;
  /** The sets: vertex u's for slot k at (k · n + u) · words. */
  readonly data: Int32Array;
  private readonly n: number;
  private readonly order: Int32Array;
  private readonly sorted: Float64Array;
  private readonly threshold = new Float64Array(SLOTS).fill(Number.NaN);
  /** When each slot was last asked for, to give the least recent one to a new threshold. */
  private readonly lastUse = new Float64Array(SLOTS);
  private readonly slotStamp = new Int32Array(SLOTS);
  /** A vertex's set in a slot is current when its stamp equals the slot's. */
  private readonly stampOf: Int32Array;
  private clock = 0;
  private stamp = 0;

  /** `order`, `sorted`: each vertex's neighbours and edge values in ascending value, n per vertex. */
  constructor(n: number, order: Int32Array, sorted: Float64Array, ledger: ByteLedger) {
    this.n = n;
    this.words = (n + 31) >>> 5;
    this.order = order;
    this.sorted = sorted;
    ledger.reserve(SLOTS * n * (this.words + 1) * 4, "building the dense rows' threshold sets");
    this.data = new Int32Array(SLOTS * n * this.words);
    this.stampOf = new Int32Array(SLOTS * n);
  }

  /** The slot holding the sets for threshold t (a fresh one, emptied, if t is not among the last asked). */
  use(t: number): number {
    const clock = ++this.clock;
    let least = 0;
    for (let k = 0; k < SLOTS; k++) {
      if (this.threshold[k] === t) {
        this.lastUse[k] = clock;
        return k;
      }
      if (this.lastUse[k] < this.lastUse[least]) least = k;
    }
    if (this.stamp === 0x7fffffff) {
      this.stampOf.fill(0);
      this.slotStamp.fill(0);
      this.stamp = 0;
    }
    this.threshold[least] = t;
    this.lastUse[least] = clock;
    this.slotStamp[least] = ++this.stamp;
    return least;
  }

  /** Where vertex u's set for the slot's threshold starts in `data`, built now if it is not current. */
  row(slot: number, u: number): number {
    const n = this.n;
    const words = this.words;
    const at = slot * n + u;
    const base = at * words;
    if (this.stampOf[at] === this.slotStamp[slot]) return base;
    this.stampOf[at] = this.slotStamp[slot];
    const data = this.data;
    data.fill(0, base, base + words);
    const t = this.threshold[slot];
    const sorted = this.sorted;
    const order = this.order;
    const start = u * n;
    for (let r = start; r < start + n && sorted[r] <= t; r++) {
      const v = order[r];
      data[base + (v >>> 5)] |= 1 << (v & 31);
    }
    return base;
  }
}

import type { ByteLedger } from "./homology-budget.js";

/**
 * Bytes per entry: key, f and coefficient (20), as much again for sortPacked's scratch space, and the
 * tally's table (stamp, key, sum, f as doubles) of at most twice as many slots as the capacity, a power of
 * two (64), with its list of slots (4).
 */
const ENTRY_BYTES = 108;
/** Chains at least this long are tallied in a hash table before the survivors are sorted. */
const TALLY_FROM = 256;
/** Slots the tally's table starts with (at most): it doubles when half full. */
const FIRST_SLOTS = 4096;
/** Doubles per slot of the tally's table: stamp, key, sum, f side by side, so a probe reads one cache line. */
const SLOT = 4;

/**
 * A chain of simplices (key, f, coefficient) collected in any order, then sorted by key with equal keys
 * summed mod p and zeros dropped. Holds the simplices whose coboundaries make up the column being reduced.
 */
export class ChainBuilder {
  key: Float64Array;
  f: Float64Array;
  coef: Int32Array;
  size = 0;
  private readonly ledger: ByteLedger;

  constructor(ledger: ByteLedger, wanted = 256) {
    this.ledger = ledger;
    let capacity = 1;
    while (capacity < wanted) capacity *= 2;
    ledger.reserve(capacity * ENTRY_BYTES, "tracking reduction chains");
    this.key = new Float64Array(capacity);
    this.f = new Float64Array(capacity);
    this.coef = new Int32Array(capacity);
  }

  clear(): void {
    this.size = 0;
    this.tallying = false;
  }

  push(key: number, f: number, coef: number): void {
    if (this.tallying) {
      this.tallyOne(key, f, coef);
      return;
    }
    if (this.size === this.key.length) this.grow();
    this.key[this.size] = key;
    this.f[this.size] = f;
    this.coef[this.size] = coef;
    this.size++;
  }

  /**
   * Adds factor × the entries [from, to) of other arrays (a finished column's chain), straight into the
   * tally when one is open (openTally), else appended.
   */
  addScaled(
    key: Float64Array,
    f: Float64Array,
    coef: Int32Array,
    from: number,
    to: number,
    factor: number,
    p: number,
  ): void {
    if (!this.tallying) {
      for (let e = from; e < to; e++) this.push(key[e], f[e], (factor * coef[e]) % p);
      return;
    }
    if (factor === 1) for (let e = from; e < to; e++) this.tallyOne(key[e], f[e], coef[e]);
    else for (let e = from; e < to; e++) this.tallyOne(key[e], f[e], (factor * coef[e]) % p);
  }

  /**
   * Before `incoming` entries are added by addScaled: when the chain will reach TALLY_FROM entries, its
   * entries so far go into a hash table, and the incoming ones follow them there instead of being
   * appended (a new pivot's chain is mostly the chains of the stored columns added, which cancel).
   */
  openTally(incoming: number): void {
    const total = this.size + incoming;
    if (total < TALLY_FROM) return;
    // The capacity bounds the table and holds the survivors, whose count is at most the total.
    while (this.key.length < total) this.grow();
    // The table starts small and doubles at half full: sized for all the entries it would be mostly empty
    // (3,600 entries fold to about 130), and slow, for it would not stay in the cache.
    let bits = 1;
    while (1 << bits < 2 * Math.min(total, FIRST_SLOTS)) bits++;
    this.setTable(bits);
    if (this.filled.length < total) this.filled = new Int32Array(this.key.length);
    this.stamp++;
    this.filledCount = 0;
    this.tallying = true;
    const key = this.key;
    const f = this.f;
    const coef = this.coef;
    for (let i = 0; i < this.size; i++) this.tallyOne(key[i], f[i], coef[i]);
  }

  /** Sorts by key, sums equal keys mod p, drops zeros. */
  compact(p: number): void {
    if (!this.tallying && this.size >= TALLY_FROM) this.openTally(0);
    if (this.tallying) this.closeTally(p);
    if (this.size < 2) return;
    if (!this.sortPacked()) this.sortRange(0, this.size - 1);
    let m = 0;
    for (let i = 0; i < this.size; ) {
      const k = this.key[i];
      const f = this.f[i];
      let sum = 0;
      while (i < this.size && this.key[i] === k) sum += this.coef[i++];
      sum %= p;
      if (sum !== 0) {
        this.key[m] = k;
        this.f[m] = f;
        this.coef[m] = sum;
        m++;
      }
    }
    this.size = m;
  }

  /**
   * Sorts by the typed array's own sort when key·2^b + position (2^b ≥ size) stays an exact double, then
   * gathers f and the coefficients by position, instead of the comparison sort below, which swaps three
   * arrays (correlation n = 200: 2 % fewer instructions in all). False when the keys are too large.
   */
  private sortPacked(): boolean {
    const size = this.size;
    const key = this.key;
    let maxKey = 0;
    for (let i = 0; i < size; i++) if (key[i] > maxKey) maxKey = key[i];
    let room = 1;
    while (room < size) room *= 2;
    if (maxKey * room + room >= 2 ** 53) return false;
    if (this.packed.length < size) this.packed = new Float64Array(key.length);
    const packed = this.packed.subarray(0, size);
    for (let i = 0; i < size; i++) packed[i] = key[i] * room + i;
    packed.sort();
    const f = this.f;
    const coef = this.coef;
    if (this.spareF.length < size) {
      this.spareF = new Float64Array(key.length);
      this.spareCoef = new Int32Array(key.length);
    }
    const spareF = this.spareF;
    const spareCoef = this.spareCoef;
    for (let r = 0; r < size; r++) {
      const x = packed[r];
      const k = Math.floor(x / room);
      const i = x - k * room;
      key[r] = k;
      spareF[r] = f[i];
      spareCoef[r] = coef[i];
    }
    f.set(spareF.subarray(0, size));
    coef.set(spareCoef.subarray(0, size));
    return true;
  }

  /** Adds one entry to the open tally (keys are integers below 2^53: Fibonacci hashing of both halves). */
  private tallyOne(k: number, f: number, coef: number): void {
    const table = this.table;
    const stamp = this.stamp;
    const mask = this.mask;
    let h = Math.imul((k >>> 0) ^ ((k / 4294967296) | 0), 0x9e3779b1) >>> this.shift;
    let at = h * SLOT;
    while (table[at] === stamp && table[at + 1] !== k) {
      h = (h + 1) & mask;
      at = h * SLOT;
    }
    if (table[at] === stamp) {
      table[at + 2] += coef;
    } else {
      table[at] = stamp;
      table[at + 1] = k;
      table[at + 2] = coef;
      table[at + 3] = f;
      this.filled[this.filledCount++] = at;
      if (2 * this.filledCount > mask + 1) this.growTable();
    }
  }

  /**
   * Uses a table of 2^bits slots: a larger array when needed, with the stamp back to 0, so that after the
   * caller's next stamp++ the old slots, in the same array or not, read as empty.
   */
  private setTable(bits: number): void {
    const slots = 1 << bits;
    if (this.table.length < slots * SLOT) {
      this.table = new Float64Array(slots * SLOT);
      this.stamp = 0;
    }
    this.mask = slots - 1;
    this.shift = 32 - bits;
  }

  /** Moves the tally to a table twice as large. At most twice the distinct keys, so within the capacity. */
  private growTable(): void {
    const old = this.table;
    const count = this.filledCount;
    const filled = this.filled;
    const keep = new Float64Array(count * SLOT);
    for (let c = 0; c < count; c++) {
      const from = filled[c];
      const to = c * SLOT;
      keep[to + 1] = old[from + 1];
      keep[to + 2] = old[from + 2];
      keep[to + 3] = old[from + 3];
    }
    this.setTable(32 - this.shift + 1);
    this.stamp++;
    this.filledCount = 0;
    for (let c = 0; c < count; c++) {
      const at = c * SLOT;
      this.tallyOne(keep[at + 1], keep[at + 3], keep[at + 2]);
    }
  }

  /**
   * Keeps the nonzero sums of the open tally as the chain, unsorted (uniform weights, n = 160: at the new
   * pivots 3,600 entries fold to about 130 on average, so only the survivors need sorting).
   */
  private closeTally(p: number): void {
    this.tallying = false;
    const table = this.table;
    const filled = this.filled;
    const key = this.key;
    const f = this.f;
    const coef = this.coef;
    let m = 0;
    for (let c = 0; c < this.filledCount; c++) {
      const at = filled[c];
      const sum = table[at + 2] % p;
      if (sum === 0) continue;
      key[m] = table[at + 1];
      f[m] = table[at + 3];
      coef[m] = sum;
      m++;
    }
    this.size = m;
  }

  /**
   * The tally's table (stamped, so it is never cleared), the slots it filled in first-seen order, and
   * whether a tally is open (entries go to the table, not the arrays).
   */
  private table = new Float64Array(0);
  private filled = new Int32Array(0);
  private filledCount = 0;
  private stamp = 0;
  private mask = 0;
  private shift = 0;
  private tallying = false;

  /** Scratch space of sortPacked, made as long as the chain's arrays when needed (counted in ENTRY_BYTES). */
  private packed = new Float64Array(0);
  private spareF = new Float64Array(0);
  private spareCoef = new Int32Array(0);

  dispose(): void {
    this.ledger.release(this.key.length * ENTRY_BYTES);
  }

  private sortRange(lo: number, hi: number): void {
    const key = this.key;
    while (hi - lo > 12) {
      const pivot = key[(lo + hi) >>> 1];
      let i = lo;
      let j = hi;
      while (i <= j) {
        while (key[i] < pivot) i++;
        while (key[j] > pivot) j--;
        if (i <= j) {
          this.swap(i, j);
          i++;
          j--;
        }
      }
      if (j - lo < hi - i) {
        this.sortRange(lo, j);
        lo = i;
      } else {
        this.sortRange(i, hi);
        hi = j;
      }
    }
    for (let a = lo + 1; a <= hi; a++) {
      for (let b = a; b > lo && key[b - 1] > key[b]; b--) this.swap(b - 1, b);
    }
  }

  private swap(i: number, j: number): void {
    const k = this.key[i];
    this.key[i] = this.key[j];
    this.key[j] = k;
    const f = this.f[i];
    this.f[i] = this.f[j];
    this.f[j] = f;
    const c = this.coef[i];
    this.coef[i] = this.coef[j];
    this.coef[j] = c;
  }

  private grow(): void {
    const capacity = this.key.length * 2;
    this.ledger.reserve(this.key.length * ENTRY_BYTES, "tracking reduction chains");
    const key = new Float64Array(capacity);
    key.set(this.key);
    const f = new Float64Array(capacity);
    f.set(this.f);
    const coef = new Int32Array(capacity);
    coef.set(this.coef);
    this.key = key;
    this.f = f;
    this.coef = coef;
  }
}

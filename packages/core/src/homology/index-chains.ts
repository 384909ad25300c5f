import { grownInt } from "./grown-array.js";
import type { ByteLedger } from "./homology-budget.js";

/**
 * Chains over Z/2 of the simplices of one dimension, each simplex named by its index in the dimension's
 * list, stored one after another. The sweep over bands keeps one per column.
 */
export class IndexChains {
  start: Int32Array = new Int32Array(64);
  length: Int32Array = new Int32Array(64);
  pool: Int32Array = new Int32Array(1024);
  count = 0;
  used = 0;
  private reserved = 0;
  private readonly ledger: ByteLedger;

  constructor(ledger: ByteLedger) {
    this.ledger = ledger;
    this.charge();
  }

  /** Opens an empty chain; entries then go in with push, before the next open. */
  open(): number {
    if (this.count === this.start.length) {
      this.start = grownInt(this.start, this.count * 2);
      this.length = grownInt(this.length, this.count * 2);
      this.charge();
    }
    this.start[this.count] = this.used;
    this.length[this.count] = 0;
    return this.count++;
  }

  push(index: number): void {
    if (this.used === this.pool.length) {
      this.pool = grownInt(this.pool, this.used * 2);
      this.charge();
    }
    this.pool[this.used++] = index;
    this.length[this.count - 1]++;
  }

  dispose(): void {
    this.ledger.release(this.reserved);
    this.reserved = 0;
  }

  private charge(): void {
    const bytes = 8 * this.start.length + 4 * this.pool.length;
    this.ledger.reserve(bytes - this.reserved, "sweeping bands of columns");
    this.reserved = bytes;
  }
}

/**
 * The Z/2 sum of chains being formed: one bit per simplex of the dimension, toggled, and the words touched
 * listed so that reading the sum out costs what was added, not the size of the dimension.
 */
export class ChainSum {
  private readonly bits: Int32Array;
  private touched: Int32Array = new Int32Array(256);
  private touchedCount = 0;
  private readonly ledger: ByteLedger;
  private readonly bytes: number;

  constructor(simplices: number, ledger: ByteLedger) {
    this.ledger = ledger;
    const words = (simplices + 31) >>> 5;
    this.bytes = 4 * words;
    ledger.reserve(this.bytes, "sweeping bands of columns");
    this.bits = new Int32Array(words);
  }

  toggle(index: number): void {
    const w = index >>> 5;
    if (this.bits[w] === 0) {
      if (this.touchedCount === this.touched.length)
        this.touched = grownInt(this.touched, this.touchedCount * 2);
      this.touched[this.touchedCount++] = w;
    }
    this.bits[w] ^= 1 << (index & 31);
  }

  add(chains: IndexChains, id: number): void {
    const from = chains.start[id];
    const to = from + chains.length[id];
    const pool = chains.pool;
    for (let e = from; e < to; e++) this.toggle(pool[e]);
  }

  /** Writes the sum into a new chain of `chains`, leaves this sum empty, and returns the chain's id. */
  takeInto(chains: IndexChains): number {
    const id = chains.open();
    const bits = this.bits;
    for (let t = 0; t < this.touchedCount; t++) {
      const w = this.touched[t];
      let word = bits[w];
      if (word === 0) continue; // emptied again, or listed twice
      bits[w] = 0;
      while (word !== 0) {
        const bit = word & -word;
        word ^= bit;
        chains.push((w << 5) + (31 - Math.clz32(bit)));
      }
    }
    this.touchedCount = 0;
    return id;
  }

  dispose(): void {
    this.ledger.release(this.bytes);
  }
}

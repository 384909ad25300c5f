import type { ByteLedger } from "./homology-budget.js";

/**
 * Open-addressing hash map from simplex keys (integers below 2^53, kept in doubles) to non-negative
 * int32 values. No objects per entry, so millions of pivots cost 12 bytes each plus slack.
 */
export class KeyMap {
  private keys: Float64Array;
  private values: Int32Array;
  private mask: number;
  size = 0;
  private readonly ledger: ByteLedger;
  private readonly stage: string;

  constructor(ledger: ByteLedger, stage: string, initialCapacity = 1024) {
    let capacity = 16;
    while (capacity < initialCapacity * 2) capacity *= 2;
    this.ledger = ledger;
    this.stage = stage;
    ledger.reserve(capacity * 12, stage);
    this.keys = new Float64Array(capacity).fill(-1);
    this.values = new Int32Array(capacity);
    this.mask = capacity - 1;
  }

  /** Value stored for `key`, or -1. */
  get(key: number): number {
    let slot = hashKey(key) & this.mask;
    for (;;) {
      const k = this.keys[slot];
      if (k === key) return this.values[slot];
      if (k === -1) return -1;
      slot = (slot + 1) & this.mask;
    }
  }

  has(key: number): boolean {
    return this.get(key) !== -1;
  }

  set(key: number, value: number): void {
    if ((this.size + 1) * 2 > this.keys.length) this.grow();
    let slot = hashKey(key) & this.mask;
    for (;;) {
      const k = this.keys[slot];
      if (k === key) {
        this.values[slot] = value;
        return;
      }
      if (k === -1) {
        this.keys[slot] = key;
        this.values[slot] = value;
        this.size++;
        return;
      }
      slot = (slot + 1) & this.mask;
    }
  }

  /** Gives the memory back to the ledger; the map is unusable afterwards. */
  dispose(): void {
    this.ledger.release(this.keys.length * 12);
    this.keys = new Float64Array(0);
    this.values = new Int32Array(0);
  }

  private grow(): void {
    const oldKeys = this.keys;
    const oldValues = this.values;
    const capacity = oldKeys.length * 2;
    this.ledger.reserve(capacity * 12, this.stage);
    this.keys = new Float64Array(capacity).fill(-1);
    this.values = new Int32Array(capacity);
    this.mask = capacity - 1;
    this.size = 0;
    for (let i = 0; i < oldKeys.length; i++) if (oldKeys[i] !== -1) this.set(oldKeys[i], oldValues[i]);
    this.ledger.release(oldKeys.length * 12);
  }
}

/** Mixes both 32-bit halves of an integer-valued double. */
function hashKey(key: number): number {
  const lo = key >>> 0;
  const hi = (key / 4294967296) >>> 0;
  let h = Math.imul(lo ^ Math.imul(hi, 0x9e3779b1), 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  return (h ^ (h >>> 16)) >>> 0;
}

/** Open-addressing index from a vertex tuple to its position in a table. */
export class TupleIndex {
  private readonly slots: Int32Array;
  private readonly mask: number;

  constructor(
    private readonly tuples: Int32Array,
    private readonly width: number,
    count: number,
  ) {
    let capacity = 16;
    while (capacity < count * 2) capacity *= 2;
    this.slots = new Int32Array(capacity).fill(-1);
    this.mask = capacity - 1;
    for (let i = 0; i < count; i++) {
      let slot = this.hash(tuples, i * width) & this.mask;
      while (this.slots[slot] !== -1) slot = (slot + 1) & this.mask;
      this.slots[slot] = i;
    }
  }

  find(probe: Int32Array): number {
    let slot = this.hash(probe, 0) & this.mask;
    for (;;) {
      const i = this.slots[slot];
      if (i === -1) return -1;
      let same = true;
      for (let j = 0; j < this.width; j++) {
        if (this.tuples[i * this.width + j] !== probe[j]) {
          same = false;
          break;
        }
      }
      if (same) return i;
      slot = (slot + 1) & this.mask;
    }
  }

  private hash(a: Int32Array, at: number): number {
    let h = 0x811c9dc5;
    for (let j = 0; j < this.width; j++) h = Math.imul(h ^ a[at + j], 0x01000193);
    h ^= h >>> 15;
    return Math.imul(h, 0x2c1b3c6d) >>> 0;
  }
}

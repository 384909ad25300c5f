/**
 * A set of edges (u, v) of a graph on n nodes, keyed u·n + v (exact in a float64 for n < 2^26; undirected
 * edges as (min, max)), in an open-addressing table with linear probing and backward-shift deletion: no
 * allocation per operation.
 */
export class EdgeKeySet {
  private readonly keys: Float64Array;
  private readonly mask: number;

  constructor(
    private readonly n: number,
    private readonly directed: boolean,
    capacity: number,
  ) {
    let size = 16;
    while (size < 2 * capacity + 2) size *= 2;
    this.keys = new Float64Array(size).fill(-1);
    this.mask = size - 1;
  }

  has(u: number, v: number): boolean {
    const key = this.directed || u < v ? u * this.n + v : v * this.n + u;
    for (let i = this.slot(key); ; i = (i + 1) & this.mask) {
      const k = this.keys[i];
      if (k === key) return true;
      if (k < 0) return false;
    }
  }

  add(u: number, v: number): void {
    const key = this.directed || u < v ? u * this.n + v : v * this.n + u;
    let i = this.slot(key);
    while (this.keys[i] >= 0 && this.keys[i] !== key) i = (i + 1) & this.mask;
    this.keys[i] = key;
  }

  delete(u: number, v: number): void {
    const key = this.directed || u < v ? u * this.n + v : v * this.n + u;
    let i = this.slot(key);
    while (this.keys[i] !== key) {
      if (this.keys[i] < 0) return;
      i = (i + 1) & this.mask;
    }
    // Backward shift: move later entries of the probe run into the hole when their home allows it.
    for (let j = (i + 1) & this.mask; this.keys[j] >= 0; j = (j + 1) & this.mask) {
      const home = this.slot(this.keys[j]);
      if (((j - home) & this.mask) >= ((j - i) & this.mask)) {
        this.keys[i] = this.keys[j];
        i = j;
      }
    }
    this.keys[i] = -1;
  }

  private slot(key: number): number {
    // Mix the two 26-bit halves of the key (integer arithmetic only).
    const low = key % 67108864;
    const high = (key - low) / 67108864;
    let h = Math.imul(low ^ Math.imul(high, 0x27d4eb2d), 0x9e3779b1);
    h ^= h >>> 15;
    return h & this.mask;
  }
}

/**
 * Two numbers per vertex, remembered while the band they were computed for stays the same: the dense
 * coboundary sweeps look up where each vertex's sorted row enters and leaves a band, and a working column
 * pushes many chain simplices, sharing most vertices, with one band. A new band forgets every vertex at
 * once (a new stamp) instead of clearing the arrays.
 */
export class VertexMemo {
  readonly first: Int32Array;
  readonly second: Int32Array;
  private readonly stampOf: Int32Array;
  private stamp = 0;
  private low = Number.NaN;
  private mid = Number.NaN;
  private high = Number.NaN;

  constructor(n: number) {
    this.first = new Int32Array(n);
    this.second = new Int32Array(n);
    this.stampOf = new Int32Array(n);
  }

  /** Uses the band (low, mid, high): what was remembered for another band is forgotten. */
  use(low: number, mid: number, high: number): void {
    if (low === this.low && mid === this.mid && high === this.high) return;
    this.low = low;
    this.mid = mid;
    this.high = high;
    if (++this.stamp === 0x7fffffff) {
      this.stampOf.fill(0);
      this.stamp = 1;
    }
  }

  has(u: number): boolean {
    return this.stampOf[u] === this.stamp;
  }

  set(u: number, first: number, second: number): void {
    this.stampOf[u] = this.stamp;
    this.first[u] = first;
    this.second[u] = second;
  }
}

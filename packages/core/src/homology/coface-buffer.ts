import type { CofaceSink } from "./coface-sink.js";
import type { ByteLedger } from "./homology-budget.js";

/**
 * Scratch list of coboundary entries, sorted into filtration order (f, then key) before it is merged into
 * the working column. Sorting is an in-place quicksort on the parallel arrays, so nothing is allocated.
 */
export class CofaceBuffer implements CofaceSink {
  f: Float64Array;
  key: Float64Array;
  coef: Int32Array;
  size = 0;
  private readonly ledger: ByteLedger;

  constructor(ledger: ByteLedger, capacity = 1024) {
    this.ledger = ledger;
    ledger.reserve(capacity * 20, "buffering a coboundary");
    this.f = new Float64Array(capacity);
    this.key = new Float64Array(capacity);
    this.coef = new Int32Array(capacity);
  }

  clear(): void {
    this.size = 0;
  }

  push(f: number, key: number, coef: number): void {
    if (this.size === this.f.length) this.grow();
    this.f[this.size] = f;
    this.key[this.size] = key;
    this.coef[this.size] = coef;
    this.size++;
  }

  sort(): void {
    this.quicksort(0, this.size - 1);
  }

  dispose(): void {
    this.ledger.release(this.f.length * 20);
  }

  private quicksort(lo: number, hi: number): void {
    const f = this.f;
    const key = this.key;
    while (hi - lo > 16) {
      const mid = (lo + hi) >>> 1;
      const pf = f[mid];
      const pk = key[mid];
      let i = lo;
      let j = hi;
      while (i <= j) {
        while (f[i] < pf || (f[i] === pf && key[i] < pk)) i++;
        while (f[j] > pf || (f[j] === pf && key[j] > pk)) j--;
        if (i <= j) {
          this.swap(i, j);
          i++;
          j--;
        }
      }
      // Recurse into the smaller side, loop on the larger: stack depth stays logarithmic.
      if (j - lo < hi - i) {
        this.quicksort(lo, j);
        lo = i;
      } else {
        this.quicksort(i, hi);
        hi = j;
      }
    }
    for (let a = lo + 1; a <= hi; a++) {
      const af = f[a];
      const ak = key[a];
      const ac = this.coef[a];
      let b = a - 1;
      while (b >= lo && (f[b] > af || (f[b] === af && key[b] > ak))) {
        f[b + 1] = f[b];
        key[b + 1] = key[b];
        this.coef[b + 1] = this.coef[b];
        b--;
      }
      f[b + 1] = af;
      key[b + 1] = ak;
      this.coef[b + 1] = ac;
    }
  }

  private swap(i: number, j: number): void {
    const f = this.f[i];
    this.f[i] = this.f[j];
    this.f[j] = f;
    const k = this.key[i];
    this.key[i] = this.key[j];
    this.key[j] = k;
    const c = this.coef[i];
    this.coef[i] = this.coef[j];
    this.coef[j] = c;
  }

  private grow(): void {
    const capacity = this.f.length * 2;
    this.ledger.reserve(this.f.length * 20, "buffering a coboundary");
    const f = new Float64Array(capacity);
    f.set(this.f);
    const key = new Float64Array(capacity);
    key.set(this.key);
    const coef = new Int32Array(capacity);
    coef.set(this.coef);
    this.f = f;
    this.key = key;
    this.coef = coef;
  }
}

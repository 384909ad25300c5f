import type { ByteLedger } from "./homology-budget.js";

/**
 * The column being reduced, kept merged and sorted in filtration order (f, then key) with no zero
 * coefficients, so its pivot is always entry 0. Adding another sorted column is one linear merge into a
 * second buffer; the buffers then swap. Linear merges beat a heap here: reduced columns of graphs whose
 * weights have no geometry grow long, and a merge touches memory in order.
 */
export class WorkingColumn {
  f: Float64Array;
  key: Float64Array;
  coef: Int32Array;
  size = 0;
  private spareF: Float64Array;
  private spareKey: Float64Array;
  private spareCoef: Int32Array;
  private readonly ledger: ByteLedger;

  constructor(ledger: ByteLedger, capacity = 1024) {
    this.ledger = ledger;
    ledger.reserve(capacity * 40, "growing the working column");
    this.f = new Float64Array(capacity);
    this.key = new Float64Array(capacity);
    this.coef = new Int32Array(capacity);
    this.spareF = new Float64Array(capacity);
    this.spareKey = new Float64Array(capacity);
    this.spareCoef = new Int32Array(capacity);
  }

  clear(): void {
    this.size = 0;
  }

  /** this += factor · other, where other[from .. to) is sorted in filtration order; coefficients mod p. */
  add(
    otherF: Float64Array,
    otherKey: Float64Array,
    otherCoef: Int32Array,
    from: number,
    to: number,
    factor: number,
    p: number,
  ): void {
    const needed = this.size + (to - from);
    if (needed > this.spareF.length) this.grow(needed);
    const af = this.f;
    const ak = this.key;
    const ac = this.coef;
    const of = this.spareF;
    const ok = this.spareKey;
    const oc = this.spareCoef;
    let i = 0;
    let j = from;
    let m = 0;
    const n = this.size;
    while (i < n && j < to) {
      const fi = af[i];
      const fj = otherF[j];
      const ki = ak[i];
      const kj = otherKey[j];
      if (fi < fj || (fi === fj && ki < kj)) {
        of[m] = fi;
        ok[m] = ki;
        oc[m] = ac[i];
        m++;
        i++;
      } else if (fi === fj && ki === kj) {
        const c = (ac[i] + factor * otherCoef[j]) % p;
        if (c !== 0) {
          of[m] = fi;
          ok[m] = ki;
          oc[m] = c;
          m++;
        }
        i++;
        j++;
      } else {
        const c = (factor * otherCoef[j]) % p;
        if (c !== 0) {
          of[m] = fj;
          ok[m] = kj;
          oc[m] = c;
          m++;
        }
        j++;
      }
    }
    while (i < n) {
      of[m] = af[i];
      ok[m] = ak[i];
      oc[m] = ac[i];
      m++;
      i++;
    }
    while (j < to) {
      const c = (factor * otherCoef[j]) % p;
      if (c !== 0) {
        of[m] = otherF[j];
        ok[m] = otherKey[j];
        oc[m] = c;
        m++;
      }
      j++;
    }
    this.spareF = af;
    this.spareKey = ak;
    this.spareCoef = ac;
    this.f = of;
    this.key = ok;
    this.coef = oc;
    this.size = m;
  }

  dispose(): void {
    this.ledger.release(this.f.length * 40);
  }

  private grow(needed: number): void {
    let capacity = this.f.length;
    while (capacity < needed) capacity *= 2;
    this.ledger.reserve((capacity - this.f.length) * 40, "growing the working column");
    const f = new Float64Array(capacity);
    f.set(this.f.subarray(0, this.size));
    const key = new Float64Array(capacity);
    key.set(this.key.subarray(0, this.size));
    const coef = new Int32Array(capacity);
    coef.set(this.coef.subarray(0, this.size));
    this.f = f;
    this.key = key;
    this.coef = coef;
    this.spareF = new Float64Array(capacity);
    this.spareKey = new Float64Array(capacity);
    this.spareCoef = new Int32Array(capacity);
  }
}

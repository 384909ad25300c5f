import type { CofaceSink } from "./coface-sink.js";
import type { ByteLedger } from "./homology-budget.js";

/**
 * Four-ary min-heap of (f, key, coefficient) entries ordered by filtration position (f, then key). Equal keys
 * may sit in the heap several times; `popMerged` sums them when they reach the top.
 */
export class CofaceHeap implements CofaceSink {
  f: Float64Array;
  key: Float64Array;
  coef: Int32Array;
  size = 0;
  private readonly ledger: ByteLedger;

  constructor(ledger: ByteLedger, capacity = 1024) {
    this.ledger = ledger;
    ledger.reserve(capacity * 20, "growing the working column");
    this.f = new Float64Array(capacity);
    this.key = new Float64Array(capacity);
    this.coef = new Int32Array(capacity);
  }

  clear(): void {
    this.size = 0;
  }

  push(f: number, key: number, coef: number): void {
    if (this.size === this.f.length) this.grow();
    let i = this.size++;
    const hf = this.f;
    const hk = this.key;
    const hc = this.coef;
    while (i > 0) {
      const parent = (i - 1) >> 2;
      const pf = hf[parent];
      if (pf < f || (pf === f && hk[parent] <= key)) break;
      hf[i] = pf;
      hk[i] = hk[parent];
      hc[i] = hc[parent];
      i = parent;
    }
    hf[i] = f;
    hk[i] = key;
    hc[i] = coef;
  }

  /** Removes the top entry (read it first from f[0], key[0], coef[0]). */
  pop(): void {
    const last = --this.size;
    if (last === 0) return;
    const hf = this.f;
    const hk = this.key;
    const hc = this.coef;
    const f = hf[last];
    const key = hk[last];
    const coef = hc[last];
    let i = 0;
    for (;;) {
      const first = 4 * i + 1;
      if (first >= last) break;
      // The least of up to four children.
      let child = first;
      let cf = hf[first];
      let ck = hk[first];
      const end = Math.min(first + 4, last);
      for (let c = first + 1; c < end; c++) {
        const x = hf[c];
        if (x < cf || (x === cf && hk[c] < ck)) {
          child = c;
          cf = x;
          ck = hk[c];
        }
      }
      if (f < cf || (f === cf && key <= ck)) break;
      hf[i] = cf;
      hk[i] = ck;
      hc[i] = hc[child];
      i = child;
    }
    hf[i] = f;
    hk[i] = key;
    hc[i] = coef;
  }

  /** Pops every copy of the top key and returns the sum of their coefficients (not reduced mod p). */
  popMerged(): number {
    const key = this.key[0];
    let sum = 0;
    while (this.size > 0 && this.key[0] === key) {
      sum += this.coef[0];
      this.pop();
    }
    return sum;
  }

  dispose(): void {
    this.ledger.release(this.f.length * 20);
  }

  private grow(): void {
    const capacity = this.f.length * 2;
    this.ledger.reserve(this.f.length * 20, "growing the working column");
    const f = new Float64Array(capacity);
    const key = new Float64Array(capacity);
    const coef = new Int32Array(capacity);
    f.set(this.f);
    key.set(this.key);
    coef.set(this.coef);
    this.f = f;
    this.key = key;
    this.coef = coef;
  }
}

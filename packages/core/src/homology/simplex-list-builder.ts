import type { SimplexList } from "./coboundary-model.js";
import type { ByteLedger } from "./homology-budget.js";

/** Appends (f, key) pairs into doubling typed arrays, charging the budget as it grows. */
export class SimplexListBuilder implements SimplexList {
  f: Float64Array;
  key: Float64Array;
  count = 0;
  private readonly ledger: ByteLedger;
  private readonly stage: string;

  constructor(ledger: ByteLedger, stage: string, capacity = 1024) {
    this.ledger = ledger;
    this.stage = stage;
    ledger.reserve(capacity * 16, stage);
    this.f = new Float64Array(capacity);
    this.key = new Float64Array(capacity);
  }

  push(f: number, key: number): void {
    if (this.count === this.f.length) this.grow();
    this.f[this.count] = f;
    this.key[this.count] = key;
    this.count++;
  }

  /** Bytes this list holds in the budget. */
  get bytes(): number {
    return this.f.length * 16;
  }

  release(): void {
    this.ledger.release(this.bytes);
    this.f = new Float64Array(0);
    this.key = new Float64Array(0);
    this.count = 0;
  }

  private grow(): void {
    const capacity = this.f.length * 2;
    this.ledger.reserve(this.f.length * 16, this.stage);
    const f = new Float64Array(capacity);
    const key = new Float64Array(capacity);
    f.set(this.f);
    key.set(this.key);
    this.f = f;
    this.key = key;
  }
}

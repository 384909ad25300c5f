import type { ByteLedger } from "./homology-budget.js";

/** Appends fixed-width vertex tuples with a value each into doubling typed arrays, charging the budget. */
export class TupleTableBuilder {
  f: Float64Array;
  tuples: Int32Array;
  count = 0;
  private readonly width: number;
  private readonly ledger: ByteLedger;
  private readonly stage: string;

  constructor(width: number, ledger: ByteLedger, stage: string, capacity = 256) {
    this.width = width;
    this.ledger = ledger;
    this.stage = stage;
    ledger.reserve(capacity * (8 + 4 * width), stage);
    this.f = new Float64Array(capacity);
    this.tuples = new Int32Array(capacity * width);
  }

  /** Appends `tuple[0 .. width)` with value `f`. */
  push(f: number, tuple: Int32Array): void {
    if (this.count === this.f.length) this.grow();
    const w = this.width;
    this.f[this.count] = f;
    for (let i = 0; i < w; i++) this.tuples[this.count * w + i] = tuple[i];
    this.count++;
  }

  /** Bytes held in the budget. */
  get bytes(): number {
    return this.f.length * (8 + 4 * this.width);
  }

  private grow(): void {
    const capacity = this.f.length * 2;
    this.ledger.reserve(this.bytes, this.stage);
    const f = new Float64Array(capacity);
    f.set(this.f);
    const tuples = new Int32Array(capacity * this.width);
    tuples.set(this.tuples);
    this.f = f;
    this.tuples = tuples;
  }
}

import type { ByteLedger } from "./homology-budget.js";

/**
 * Finished columns of the coboundary reduction, each owning one pivot, in up to two forms:
 * - the chain: the simplices (key, f, coefficient) whose coboundaries sum to the column — short on most
 *   data, and the column is rebuilt from it on demand;
 * - the reduced entries themselves (f, key, coefficient) in filtration order, pivot first — kept when
 *   rebuilding would cost more than reading them, or when the chain grew too long to track.
 * At least one form is present.
 */
export class ColumnStore {
  /** Reduced entries: start in the entry pool, or -1 when not kept. */
  entryStart: Int32Array;
  entryLength: Int32Array;
  /** Chain: start in the chain pool, or -1 when not tracked. */
  chainStart: Int32Array;
  chainLength: Int32Array;
  /** Coefficient of the pivot in the column. */
  pivotCoef: Int32Array;
  columns = 0;
  entryF: Float64Array;
  entryKey: Float64Array;
  entryCoef: Int32Array;
  entriesUsed = 0;
  chainKey: Float64Array;
  chainF: Float64Array;
  chainCoef: Int32Array;
  chainUsed = 0;
  private readonly ledger: ByteLedger;

  constructor(ledger: ByteLedger) {
    this.ledger = ledger;
    ledger.reserve(256 * 20 + 2048 * 20, "storing reduced columns");
    this.entryStart = new Int32Array(256);
    this.entryLength = new Int32Array(256);
    this.chainStart = new Int32Array(256);
    this.chainLength = new Int32Array(256);
    this.pivotCoef = new Int32Array(256);
    this.entryF = new Float64Array(1024);
    this.entryKey = new Float64Array(1024);
    this.entryCoef = new Int32Array(1024);
    this.chainKey = new Float64Array(1024);
    this.chainF = new Float64Array(1024);
    this.chainCoef = new Int32Array(1024);
  }

  /** Opens a column; then give it a chain (setChain), entries (appendEntry), or both. */
  open(pivotCoef: number): number {
    if (this.columns === this.entryStart.length) this.growColumns();
    const id = this.columns++;
    this.entryStart[id] = -1;
    this.entryLength[id] = 0;
    this.chainStart[id] = -1;
    this.chainLength[id] = 0;
    this.pivotCoef[id] = pivotCoef;
    return id;
  }

  setChain(id: number, key: Float64Array, f: Float64Array, coef: Int32Array, length: number): void {
    while (this.chainUsed + length > this.chainKey.length) this.growChains();
    this.chainKey.set(key.subarray(0, length), this.chainUsed);
    this.chainF.set(f.subarray(0, length), this.chainUsed);
    this.chainCoef.set(coef.subarray(0, length), this.chainUsed);
    this.chainStart[id] = this.chainUsed;
    this.chainLength[id] = length;
    this.chainUsed += length;
  }

  /** Appends one reduced entry to column `id`, which must be the last column opened. */
  appendEntry(id: number, f: number, key: number, coef: number): void {
    if (this.entriesUsed === this.entryF.length) this.growEntries();
    if (this.entryStart[id] < 0) this.entryStart[id] = this.entriesUsed;
    this.entryF[this.entriesUsed] = f;
    this.entryKey[this.entriesUsed] = key;
    this.entryCoef[this.entriesUsed] = coef;
    this.entriesUsed++;
    this.entryLength[id]++;
  }

  dispose(): void {
    this.ledger.release(this.entryStart.length * 20 + this.entryF.length * 20 + this.chainKey.length * 20);
  }

  private growColumns(): void {
    const size = this.entryStart.length * 2;
    this.ledger.reserve(this.entryStart.length * 20, "storing reduced columns");
    this.entryStart = grownInt(this.entryStart, size);
    this.entryLength = grownInt(this.entryLength, size);
    this.chainStart = grownInt(this.chainStart, size);
    this.chainLength = grownInt(this.chainLength, size);
    this.pivotCoef = grownInt(this.pivotCoef, size);
  }

  private growEntries(): void {
    const size = this.entryF.length * 2;
    this.ledger.reserve(this.entryF.length * 20, "storing reduced columns");
    this.entryF = grownFloat(this.entryF, size);
    this.entryKey = grownFloat(this.entryKey, size);
    this.entryCoef = grownInt(this.entryCoef, size);
  }

  private growChains(): void {
    const size = this.chainKey.length * 2;
    this.ledger.reserve(this.chainKey.length * 20, "storing reduced columns");
    this.chainKey = grownFloat(this.chainKey, size);
    this.chainF = grownFloat(this.chainF, size);
    this.chainCoef = grownInt(this.chainCoef, size);
  }
}

function grownInt(a: Int32Array, size: number): Int32Array {
  const b = new Int32Array(size);
  b.set(a);
  return b;
}

function grownFloat(a: Float64Array, size: number): Float64Array {
  const b = new Float64Array(size);
  b.set(a);
  return b;
}

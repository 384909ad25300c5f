import { grownFloat, grownInt } from "./grown-array.js";
import type { ByteLedger } from "./homology-budget.js";

const COLUMN_BYTES = 12; // chainStart, chainLength, pivotCoef
const CHAIN_ENTRY_BYTES = 20; // key (f64), f (f64), coefficient (i32)

/**
 * Finished columns of the coboundary reduction, each owning one pivot. A column is kept as its chain only:
 * the simplices (key, f, coefficient) whose coboundaries sum to it, short on most data; the reduction
 * regenerates the column's entries from the chain when it needs them (implicit reduction).
 */
export class ColumnStore {
  /** Chain of column id: start in the chain pool, and length. */
  chainStart: Int32Array;
  chainLength: Int32Array;
  /** Coefficient of the pivot in the column. */
  pivotCoef: Int32Array;
  columns = 0;
  chainKey: Float64Array;
  chainF: Float64Array;
  chainCoef: Int32Array;
  chainUsed = 0;
  private readonly ledger: ByteLedger;

  constructor(ledger: ByteLedger) {
    this.ledger = ledger;
    ledger.reserve(256 * COLUMN_BYTES + 1024 * CHAIN_ENTRY_BYTES, "storing reduced columns");
    this.chainStart = new Int32Array(256);
    this.chainLength = new Int32Array(256);
    this.pivotCoef = new Int32Array(256);
    this.chainKey = new Float64Array(1024);
    this.chainF = new Float64Array(1024);
    this.chainCoef = new Int32Array(1024);
  }

  /** Opens a column with its pivot's coefficient; then give it its chain with setChain. */
  open(pivotCoef: number): number {
    if (this.columns === this.chainStart.length) this.growColumns();
    const id = this.columns++;
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

  dispose(): void {
    this.ledger.release(this.chainStart.length * COLUMN_BYTES + this.chainKey.length * CHAIN_ENTRY_BYTES);
  }

  private growColumns(): void {
    const size = this.chainStart.length * 2;
    this.ledger.reserve(this.chainStart.length * COLUMN_BYTES, "storing reduced columns");
    this.chainStart = grownInt(this.chainStart, size);
    this.chainLength = grownInt(this.chainLength, size);
    this.pivotCoef = grownInt(this.pivotCoef, size);
  }

  private growChains(): void {
    const size = this.chainKey.length * 2;
    this.ledger.reserve(this.chainKey.length * CHAIN_ENTRY_BYTES, "storing reduced columns");
    this.chainKey = grownFloat(this.chainKey, size);
    this.chainF = grownFloat(this.chainF, size);
    this.chainCoef = grownInt(this.chainCoef, size);
  }
}

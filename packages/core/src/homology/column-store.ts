import type { ByteLedger } from "./homology-budget.js";

/**
 * Finished columns of the coboundary reduction, each owning one pivot. A column is stored either
 * implicitly, as c · δσ for a single simplex σ (emergent pairs: nothing to store but σ), or explicitly as
 * its reduced entries (f, key, coefficient) in filtration order, pivot first. Storing the reduced entries
 * rather than the simplices that were combined keeps column additions from snowballing on graphs whose
 * weights have no geometry.
 */
export class ColumnStore {
  /** Start of each explicit column in the pool; -1 marks an implicit column. */
  start: Int32Array;
  length: Int32Array;
  /** Coefficient of the pivot in the column. */
  pivotCoef: Int32Array;
  /** For implicit columns: the simplex σ and its value. */
  simplexKey: Float64Array;
  simplexF: Float64Array;
  columns = 0;
  key: Float64Array;
  f: Float64Array;
  coef: Int32Array;
  used = 0;
  private readonly ledger: ByteLedger;

  constructor(ledger: ByteLedger) {
    this.ledger = ledger;
    ledger.reserve(256 * 28 + 1024 * 20, "storing reduced columns");
    this.start = new Int32Array(256);
    this.length = new Int32Array(256);
    this.pivotCoef = new Int32Array(256);
    this.simplexKey = new Float64Array(256);
    this.simplexF = new Float64Array(256);
    this.key = new Float64Array(1024);
    this.f = new Float64Array(1024);
    this.coef = new Int32Array(1024);
  }

  /** A column equal to δσ (coefficient of the pivot: `pivotCoef`). */
  addImplicit(simplexKey: number, simplexF: number, pivotCoef: number): number {
    const id = this.nextId();
    this.start[id] = -1;
    this.simplexKey[id] = simplexKey;
    this.simplexF[id] = simplexF;
    this.pivotCoef[id] = pivotCoef;
    return id;
  }

  /** Opens an explicit column; fill it with `append`, in filtration order, pivot first. */
  openExplicit(): number {
    const id = this.nextId();
    this.start[id] = this.used;
    this.length[id] = 0;
    return id;
  }

  append(id: number, f: number, key: number, coef: number): void {
    if (this.used === this.key.length) this.growPool();
    this.f[this.used] = f;
    this.key[this.used] = key;
    this.coef[this.used] = coef;
    this.used++;
    if (this.length[id]++ === 0) this.pivotCoef[id] = coef;
  }

  dispose(): void {
    this.ledger.release(this.start.length * 28 + this.key.length * 20);
  }

  private nextId(): number {
    if (this.columns === this.start.length) {
      const size = this.start.length * 2;
      this.ledger.reserve(this.start.length * 28, "storing reduced columns");
      this.start = grownInt(this.start, size);
      this.length = grownInt(this.length, size);
      this.pivotCoef = grownInt(this.pivotCoef, size);
      this.simplexKey = grownFloat(this.simplexKey, size);
      this.simplexF = grownFloat(this.simplexF, size);
    }
    return this.columns++;
  }

  private growPool(): void {
    const size = this.key.length * 2;
    this.ledger.reserve(this.key.length * 20, "storing reduced columns");
    this.key = grownFloat(this.key, size);
    this.f = grownFloat(this.f, size);
    this.coef = grownInt(this.coef, size);
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

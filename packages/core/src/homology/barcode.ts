import type { WeightSemantics } from "../filtration/weight-semantics.js";

/**
 * One interval of the barcode, in the user's weight units. A class of dimension `dim` is born when the
 * threshold reaches `birth` and dies when it reaches `death`; `death` is null for an essential class, which
 * never dies. For similarity weights births are larger numbers than deaths (thresholds go down).
 */
export interface Bar {
  readonly dim: number;
  readonly birth: number;
  readonly death: number | null;
  /**
   * The simplex whose entry creates the class: its vertices ascending (cliques) or its ordered tuple
   * (directed). For dim 0, the vertex whose component is the younger one when two components merge.
   */
  readonly birthSimplex: readonly number[];
  /** The simplex whose entry kills the class (null for essential classes). */
  readonly deathSimplex: readonly number[] | null;
}

/** Work counters per dimension (index = dimension of the columns, 0 for union–find). */
export interface BarcodeStats {
  /** Simplices of each dimension in the whole complex (dimension 0 … maxDim). */
  readonly simplices: number[];
  /** Columns skipped because their simplex already killed a class one dimension lower (clearing). */
  readonly clearedColumns: number[];
  /** Columns skipped because their simplex is in an apparent pair of zero persistence. */
  readonly apparentPairs: number[];
  /** Columns paired at once with their earliest coface (emergent pairs), without building the coboundary. */
  readonly emergentPairs: number[];
  /** Columns that went through the reduction loop. */
  readonly columnsReduced: number[];
  /** Column additions performed during the reduction. */
  readonly columnAdditions: number[];
  /**
   * Finished columns with long chains that kept their sorted reduced entries, so that adding them reads
   * entries instead of regenerating the coboundaries of their chains.
   */
  readonly storedColumns: number[];
  /**
   * Columns settled by the sweep over bands of values (apparent pairs not included: they are counted as
   * such); the sweep's column additions are counted in columnAdditions.
   */
  readonly sweptColumns: number[];
  /** Highest number of bytes held in tables, heaps and columns. */
  readonly peakBytes: number;
  /** How coboundaries were produced. */
  readonly representation: "clique-dense" | "clique-sparse" | "directed-tables";
}

export interface Barcode {
  /** Sorted by dimension, then by birth in filtration order, then by death (essential last). */
  readonly bars: Bar[];
  readonly prime: number;
  readonly maxDim: number;
  readonly semantics: WeightSemantics;
  readonly directed: boolean;
  /** Threshold (user units) at which every vertex is born. */
  readonly start: number;
  /** Whether bars with birth = death were kept. */
  readonly keepZeroLength: boolean;
  readonly stats: BarcodeStats;
}

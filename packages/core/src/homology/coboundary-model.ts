import type { CofaceSink } from "./coface-sink.js";

/** Simplices of one dimension as parallel arrays: filtration value and key. */
export interface SimplexList {
  readonly f: Float64Array;
  readonly key: Float64Array;
  readonly count: number;
}

/**
 * What the reduction needs to know about a complex, whatever stores it. A simplex of a given dimension is
 * named by a non-negative integer key; the filtration order is (f, dimension, key), so within a dimension
 * a smaller key breaks ties in f. Coboundaries are produced on demand (implicitly, or from tables).
 */
export interface CoboundaryModel {
  readonly vertexCount: number;
  /** Every simplex of dimension `dim` ≥ 1, in any order. */
  listSimplices(dim: number): SimplexList;
  /** Forget the list of dimension `dim` (memory goes back to the budget). */
  releaseSimplices(dim: number): void;
  /** Ascending vertices (undirected) or the ordered tuple (directed) of a simplex, written into `out`. */
  vertices(dim: number, key: number, out: Int32Array): void;
  /** Pushes the entries of factor · δ(simplex) into the sink (any order), coefficients in 0 .. p-1. */
  pushCoboundary(dim: number, key: number, f: number, factor: number, p: number, sink: CofaceSink): void;
  /**
   * The earliest coface of the simplex when it enters at the same value f, else -1. Sets `sign` to its
   * coefficient in the coboundary.
   */
  zeroCoface(dim: number, key: number, f: number): number;
  /** The latest facet of the simplex when it has the same value f, else -1. Sets `sign` likewise. */
  zeroFacet(dim: number, key: number, f: number): number;
  /** Typical number of cofaces of a dim-simplex: weighs rebuilding a column from its chain against storing it. */
  cofaceEstimate(dim: number): number;
  /** ±1: coefficient of the last zeroCoface / zeroFacet pair. */
  sign: number;
  /**
   * Optional shortcut for the pass that picks the columns to reduce, with the answers of the zeroFacet /
   * zeroCoface tests: 1 when the simplex is the coface of an apparent pair one dimension lower (dim ≥ 2;
   * its column is cleared), 2 when it opens an apparent pair (the coface's key in `apparentCoface`), 0
   * otherwise; -1 when this model has no shortcut for the simplex.
   */
  settleUpFront?(dim: number, key: number, f: number): number;
  /** Key of the coface found by the last settleUpFront that returned 2. */
  apparentCoface?: number;
}

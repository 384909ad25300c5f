import type { WorkControl } from "../work/work-control.js";

/** Limits shared by every counting entry point (time limit and progress included). */
export interface CountOptions extends WorkControl {
  /** Highest simplex dimension counted; higher ones are ignored and `truncated` is set. Default: no cap. */
  maxDim?: number;
  /**
   * Stop with a SimplexBudgetError after this many simplices in total (all dimensions, vertices included).
   * Nothing is stored, so the budget bounds time, not memory. Default: DEFAULT_SIMPLEX_BUDGET.
   */
  budget?: number;
}

/** Simplex counts at every threshold of a grid, from one enumeration. */
export interface SweepCounts {
  /** The grid's thresholds (user units, filtration order). */
  thresholds: Float64Array;
  /** counts[t][k] = number of k-simplices present at threshold t (k = 0..top). */
  counts: Float64Array[];
  /** euler[t] = Σ_k (−1)^k counts[t][k]. */
  euler: Float64Array;
  /** True when maxDim cut off simplices that exist at the last threshold. */
  truncated: boolean;
}

/** Per-node participation: how many simplices of each dimension a node lies in. */
export interface NodeParticipation {
  /** member[k][v] = number of k-simplices containing v. */
  member: Float64Array[];
  /** Directed only: source[k][v] = number of k-simplices with v as first vertex v0. */
  source?: Float64Array[];
  /** Directed only: sink[k][v] = number of k-simplices with v as last vertex vk. */
  sink?: Float64Array[];
}

/** Simplex counts of one complex. */
export interface SimplexCounts {
  /** counts[k] = number of k-simplices (k = 0..top). */
  counts: Float64Array;
  euler: number;
  truncated: boolean;
  participation?: NodeParticipation;
  /**
   * edgeParticipation[k][slot] = number of k-simplices (k ≥ 1) containing the edge stored at CSR slot
   * `slot`; both slots of an undirected edge carry the same value. Row 0 is all zeros.
   */
  edgeParticipation?: Float64Array[];
}

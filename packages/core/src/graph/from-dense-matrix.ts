import { checkWeight } from "./check-weight.js";
import { fromEdgeList } from "./from-edge-list.js";
import { GraphInputError } from "./graph-input-error.js";
import type { NegativePolicy, SymmetrizePolicy, WarningSink } from "./policies.js";
import type { WeightedGraph } from "./weighted-graph.js";

export interface DenseMatrixOptions {
  directed: boolean;
  labels?: readonly string[];
  /** Undirected only: how to merge a_ij and a_ji when they differ. Default "error". */
  symmetrize?: SymmetrizePolicy;
  /** Default "error". */
  negative?: NegativePolicy;
  onWarning?: WarningSink;
}

/**
 * Builds a graph from an n×n row-major matrix in which NaN means "no edge". The diagonal is ignored.
 * Undirected: a_ij and a_ji must agree unless a symmetrise policy is chosen; a missing side counts as
 * "no edge", so `max` keeps the present weight, `min` drops the pair, `mean` averages the present values.
 */
export function fromDenseMatrix(
  n: number,
  values: ArrayLike<number>,
  options: DenseMatrixOptions,
): WeightedGraph {
  if (values.length !== n * n) {
    throw new GraphInputError("bad-shape", `expected ${n}×${n} = ${n * n} values, got ${values.length}`);
  }
  const negative = options.negative ?? "error";
  const symmetrize = options.symmetrize ?? "error";
  const sources: number[] = [];
  const targets: number[] = [];
  const weights: number[] = [];
  const read = (i: number, j: number): number => {
    const w = values[i * n + j];
    return Number.isNaN(w) ? w : checkWeight(w, negative, () => ({ row: i, col: j }));
  };
  for (let i = 0; i < n; i++) {
    for (let j = options.directed ? 0 : i + 1; j < n; j++) {
      if (i === j) continue;
      let w = read(i, j);
      if (!options.directed) w = merge(w, read(j, i), symmetrize, i, j);
      if (Number.isNaN(w)) continue;
      sources.push(i);
      targets.push(j);
      weights.push(w);
    }
  }
  // Weights are checked above; "keep" stops the edge-list builder from judging them twice.
  return fromEdgeList({
    n,
    sources,
    targets,
    weights,
    directed: options.directed,
    labels: options.labels,
    negative: "keep",
    onWarning: options.onWarning,
  });
}

function merge(a: number, b: number, policy: SymmetrizePolicy, i: number, j: number): number {
  if (a === b || (Number.isNaN(a) && Number.isNaN(b))) return a;
  switch (policy) {
    case "max":
      return Number.isNaN(a) ? b : Number.isNaN(b) ? a : Math.max(a, b);
    case "min":
      return Number.isNaN(a) || Number.isNaN(b) ? Number.NaN : Math.min(a, b);
    case "mean":
      return Number.isNaN(a) ? b : Number.isNaN(b) ? a : (a + b) / 2;
    default:
      throw new GraphInputError(
        "asymmetric",
        `matrix is not symmetric: entry (${i + 1},${j + 1}) is ${a} but (${j + 1},${i + 1}) is ${b}; ` +
          "read it as directed or choose a symmetrise policy (max, min, mean)",
        { row: i, col: j },
      );
  }
}

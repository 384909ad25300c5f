import { checkWeight } from "./check-weight.js";
import { fromEdgeList } from "./from-edge-list.js";
import { GraphInputError } from "./graph-input-error.js";
import { type NegativePolicy, noteNegatives, type SymmetrizePolicy, type WarningSink } from "./policies.js";
import type { WeightedGraph } from "./weighted-graph.js";

/**
 * a_ij and a_ji whose difference is at most this share of the larger magnitude count as equal. numpy's
 * corrcoef differs from exact symmetry in the last bit or two (relative 4e-16 measured over 260,000 pairs);
 * a real asymmetry is many orders larger.
 */
export const DEFAULT_SYMMETRY_TOLERANCE = 1e-9;

export interface DenseMatrixOptions {
  directed: boolean;
  labels?: readonly string[];
  /** Undirected only: how to merge a_ij and a_ji when they differ. Default "error". */
  symmetrize?: SymmetrizePolicy;
  /**
   * Undirected only: a_ij and a_ji with |a_ij − a_ji| ≤ tolerance · max(|a_ij|, |a_ji|) are one weight, their
   * mean, whatever `symmetrize` says. Default DEFAULT_SYMMETRY_TOLERANCE (1e-9); 0 demands exact equality.
   */
  symmetryTolerance?: number;
  /** Default "error". */
  negative?: NegativePolicy;
  onWarning?: WarningSink;
}

/**
 * Builds a graph from an n×n row-major matrix in which NaN means "no edge". The diagonal is ignored; any
 * other value, 0 included, is an edge (readers decide which zeros mean "no edge" before calling this).
 * Undirected: a_ij and a_ji must agree to the symmetry tolerance unless a symmetrise policy is chosen; a
 * missing side counts as "no edge", so `max` keeps the present weight, `min` drops the pair, `mean` averages
 * the present values.
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
  const tolerance = options.symmetryTolerance ?? DEFAULT_SYMMETRY_TOLERANCE;
  if (!(tolerance >= 0)) throw new RangeError(`symmetryTolerance must be ≥ 0, got ${tolerance}`);
  const sources: number[] = [];
  const targets: number[] = [];
  const weights: number[] = [];
  // Edges (undirected: pairs) with a negative weight on either side, for the note on what became of them.
  let negatives = 0;
  const read = (i: number, j: number): number => {
    const w = values[i * n + j];
    return Number.isNaN(w) ? w : checkWeight(w, negative, () => ({ row: i, col: j }));
  };
  for (let i = 0; i < n; i++) {
    for (let j = options.directed ? 0 : i + 1; j < n; j++) {
      if (i === j) continue;
      if (values[i * n + j] < 0 || (!options.directed && values[j * n + i] < 0)) negatives++;
      let w = read(i, j);
      if (!options.directed) w = merge(w, read(j, i), symmetrize, tolerance, i, j);
      if (Number.isNaN(w)) continue;
      sources.push(i);
      targets.push(j);
      weights.push(w);
    }
  }
  noteNegatives(negatives, negative, options.onWarning);
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

function merge(
  a: number,
  b: number,
  policy: SymmetrizePolicy,
  tolerance: number,
  i: number,
  j: number,
): number {
  if (a === b || (Number.isNaN(a) && Number.isNaN(b))) return a;
  // Equal up to rounding (both present): one weight. The mean keeps the result independent of which
  // triangle of the matrix is read first.
  if (Math.abs(a - b) <= tolerance * Math.max(Math.abs(a), Math.abs(b))) return (a + b) / 2;
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
        `matrix is not symmetric: entry (${i + 1},${j + 1}) is ${a} but (${j + 1},${i + 1}) is ${b}` +
          `${asymmetryNote(a, b, tolerance)}; read it as directed or choose a symmetrise policy (max, min, mean)`,
        { row: i, col: j },
      );
  }
}

/**
 * " (relative difference 0.03, above the tolerance 1e-9)" when both values are present, else "": what
 * readers add when they restate the asymmetry with file positions.
 */
export function asymmetryNote(a: number, b: number, tolerance = DEFAULT_SYMMETRY_TOLERANCE): string {
  if (Number.isNaN(a) || Number.isNaN(b)) return "";
  const relative = Math.abs(a - b) / Math.max(Math.abs(a), Math.abs(b));
  return ` (relative difference ${Number(relative.toPrecision(2))}, above the tolerance ${tolerance})`;
}

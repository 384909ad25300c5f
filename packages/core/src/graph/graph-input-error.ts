/**
 * A problem with the data a graph is built from. Builders know positions in their input (matrix row and
 * column, or edge index); readers catch this and restate it with the file, line and column.
 */
export type GraphInputProblem =
  | "not-finite"
  | "asymmetric"
  | "negative-weight"
  | "duplicate-edge"
  | "node-out-of-range"
  | "bad-shape";

export interface GraphInputLocation {
  /** 0-based matrix row, for dense input. */
  row?: number;
  /** 0-based matrix column, for dense input. */
  col?: number;
  /** 0-based position in an edge list. */
  edge?: number;
  /** For duplicates: 0-based position of the first occurrence. */
  firstEdge?: number;
}

export class GraphInputError extends Error {
  readonly problem: GraphInputProblem;
  readonly location: GraphInputLocation;

  constructor(problem: GraphInputProblem, message: string, location: GraphInputLocation = {}) {
    super(message);
    this.name = "GraphInputError";
    this.problem = problem;
    this.location = location;
  }
}

import { describe, expect, it } from "vitest";
import { fromDenseMatrix } from "./from-dense-matrix.js";
import { fromEdgeList } from "./from-edge-list.js";
import { GraphInputError } from "./graph-input-error.js";

const N = Number.NaN;

function thrown(run: () => unknown): GraphInputError {
  try {
    run();
  } catch (error) {
    if (error instanceof GraphInputError) return error;
    throw error;
  }
  throw new Error("expected a GraphInputError");
}

describe("fromDenseMatrix: symmetry up to rounding", () => {
  // 0.1 + 0.2 = 0.30000000000000004 in binary64, one unit in the last place above 0.3 (IEEE 754; common practice).
  const a = 0.1 + 0.2;

  it("reads a_ij and a_ji that differ in the last bit as one edge weighing their mean", () => {
    const graph = fromDenseMatrix(2, [N, a, 0.3, N], { directed: false });
    expect(Array.from(graph.weights)).toEqual([(a + 0.3) / 2, (a + 0.3) / 2]);
  });

  it("refuses a larger difference, naming both cells and how far apart they are", () => {
    const error = thrown(() => fromDenseMatrix(2, [N, 0.5, 0.7, N], { directed: false }));
    expect(error.problem).toBe("asymmetric");
    expect(error.location).toEqual({ row: 0, col: 1 });
    expect(error.message).toBe(
      "matrix is not symmetric: entry (1,2) is 0.5 but (2,1) is 0.7 (relative difference 0.29, above the tolerance 1e-9); read it as directed or choose a symmetrise policy (max, min, mean)",
    );
  });

  it("demands exact equality with tolerance 0, and a present and a missing side always differ", () => {
    expect(
      thrown(() => fromDenseMatrix(2, [N, a, 0.3, N], { directed: false, symmetryTolerance: 0 })).problem,
    ).toBe("asymmetric");
    expect(thrown(() => fromDenseMatrix(2, [N, 1, N, N], { directed: false })).message).toMatch(
      /\(2,1\) is NaN; read it/,
    );
  });
});

describe("negative-weight policies say what they did", () => {
  const matrix = [N, -0.5, 0.2, -0.5, N, -0.1, 0.2, -0.1, N];

  it("counts undirected pairs once", () => {
    const warnings: string[] = [];
    const graph = fromDenseMatrix(3, matrix, {
      directed: false,
      negative: "drop",
      onWarning: (w) => warnings.push(w),
    });
    expect(graph.targets.length / 2).toBe(1);
    expect(warnings).toEqual(["dropped 2 edges with a negative weight"]);
  });

  it("abs keeps the edges with |w|; keep is silent", () => {
    const warnings: string[] = [];
    const graph = fromDenseMatrix(3, matrix, {
      directed: false,
      negative: "abs",
      onWarning: (w) => warnings.push(w),
    });
    expect(Array.from(graph.weights).sort()).toEqual([0.1, 0.1, 0.2, 0.2, 0.5, 0.5]);
    expect(warnings).toEqual(["took the absolute value of the negative weight of 2 edges"]);
    const kept: string[] = [];
    fromDenseMatrix(3, matrix, { directed: true, negative: "keep", onWarning: (w) => kept.push(w) });
    expect(kept).toEqual([]);
  });

  it("edge lists say the same", () => {
    const warnings: string[] = [];
    const graph = fromEdgeList({
      n: 3,
      sources: [0, 1],
      targets: [1, 2],
      weights: [-1, 2],
      directed: true,
      negative: "drop",
      onWarning: (w) => warnings.push(w),
    });
    expect(graph.targets.length).toBe(1);
    expect(warnings).toEqual(["dropped 1 edge with a negative weight"]);
  });
});

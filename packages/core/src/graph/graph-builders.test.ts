/**
 * The builders' policies and messages, worked by hand: how an asymmetric matrix is made undirected, when two
 * sides count as equal, what the warnings count, which positions a duplicate names, how a graphology graph's
 * type decides direction. Each case is one a user meets with a real file; the values are small enough to
 * check on paper.
 */
import { MultiGraph } from "graphology";
import { describe, expect, it } from "vitest";
import { errorOf } from "../../../../test/support/error-of.js";
import { fromDenseMatrix } from "./from-dense-matrix.js";
import { fromEdgeList } from "./from-edge-list.js";
import { fromGraphology } from "./from-graphology.js";
import { GraphInputError } from "./graph-input-error.js";
import { thresholdSubgraph } from "./threshold-subgraph.js";
import { density } from "./weighted-graph.js";

const N = Number.NaN;

const thrown = (run: () => unknown) => errorOf(run, GraphInputError);

function weightOf(graph: ReturnType<typeof fromEdgeList>, u: number, v: number): number | undefined {
  for (let s = graph.offsets[u]; s < graph.offsets[u + 1]; s++)
    if (graph.targets[s] === v) return graph.weights[s];
  return undefined;
}

describe("fromDenseMatrix: making an asymmetric matrix undirected", () => {
  // Upper triangle 4, 1, NaN (absent); lower triangle 2, NaN, 6. Worked by hand per policy:
  //   max: a missing side is ignored (as numpy.fmax): (0,1) 4, (0,2) 1, (1,2) 6;
  //   min: a missing side makes the edge missing (as numpy.minimum propagates NaN): (0,1) 2 only;
  //   mean: a missing side is ignored (as numpy.nanmean): (0,1) 3, (0,2) 1, (1,2) 6.
  const m = [0, 4, 1, 2, 0, N, N, 6, 0];
  const build = (symmetrize: "max" | "min" | "mean") =>
    fromDenseMatrix(3, m, { directed: false, symmetrize });

  it("max, min and mean, with missing cells", () => {
    const max = build("max");
    expect([weightOf(max, 0, 1), weightOf(max, 0, 2), weightOf(max, 1, 2)]).toEqual([4, 1, 6]);
    const min = build("min");
    expect([weightOf(min, 0, 1), weightOf(min, 0, 2), weightOf(min, 1, 2)]).toEqual([
      2,
      undefined,
      undefined,
    ]);
    const mean = build("mean");
    expect([weightOf(mean, 0, 1), weightOf(mean, 0, 2), weightOf(mean, 1, 2)]).toEqual([3, 1, 6]);
  });

  it("two sides within the relative tolerance are one edge at their mean; the bound itself is inside", () => {
    // |2 − 1| = 1 = 0.5 × max(|2|, |1|): inside, so (2 + 1) / 2 even under "error".
    const equalAtBound = fromDenseMatrix(2, [0, 2, 1, 0], { directed: false, symmetryTolerance: 0.5 });
    expect(weightOf(equalAtBound, 0, 1)).toBe(1.5);
    const outside = thrown(() =>
      fromDenseMatrix(2, [0, 2, 1, 0], { directed: false, symmetryTolerance: 0.49 }),
    );
    expect(outside.problem).toBe("asymmetric");
  });

  it("refuses a negative tolerance and a value count that is not n × n, saying which", () => {
    expect(() => fromDenseMatrix(2, [0, 1, 1, 0], { directed: false, symmetryTolerance: -1 })).toThrow(
      "symmetryTolerance must be ≥ 0, got -1",
    );
    const shape = thrown(() => fromDenseMatrix(2, [0, 1, 1], { directed: false }));
    expect(shape.problem).toBe("bad-shape");
    expect(shape.message).toBe("expected 2×2 = 4 values, got 3");
  });

  it("counts a pair with a negative weight on either side once, and arcs one by one", () => {
    const notes: string[] = [];
    // Undirected: pair (0,1) negative below the diagonal only, pair (1,2) on both sides, (0,2) positive.
    fromDenseMatrix(3, [0, 0.5, 1, -0.5, 0, -2, 1, -2, 0], {
      directed: false,
      negative: "abs",
      symmetrize: "max",
      onWarning: (note) => notes.push(note),
    });
    expect(notes).toEqual(["took the absolute value of the negative weight of 2 edges"]);
    notes.length = 0;
    fromDenseMatrix(3, [0, -1, 1, 1, 0, -2, -3, 1, 0], {
      directed: true,
      negative: "drop",
      onWarning: (note) => notes.push(note),
    });
    expect(notes).toEqual(["dropped 3 edges with a negative weight"]);
  });
});

describe("fromEdgeList: warnings and duplicates", () => {
  it("says nothing when there is nothing to say, and counts self-loops apart from negative edges", () => {
    const notes: string[] = [];
    fromEdgeList({
      n: 3,
      sources: [0, 1],
      targets: [1, 2],
      weights: [1, 2],
      directed: false,
      onWarning: (x) => notes.push(x),
    });
    expect(notes).toEqual([]);
    fromEdgeList({
      n: 3,
      sources: [0, 1, 2, 0],
      targets: [0, 2, 2, 1],
      weights: [-1, 2, -3, -4],
      directed: false,
      negative: "abs",
      onWarning: (x) => notes.push(x),
    });
    // Two self-loops (one of them negative, not counted as a negative edge) and one negative edge.
    expect(notes).toEqual([
      "took the absolute value of the negative weight of 1 edge",
      "dropped 2 self-loops",
    ]);
  });

  it("names both positions of a duplicate in a later row", () => {
    // Row 2 holds 2→0 (edge 1), 2→1 (edge 2) and 2→1 again (edge 4); edge 3 is 0→1.
    const error = thrown(() =>
      fromEdgeList({
        n: 3,
        sources: [0, 2, 2, 0, 2],
        targets: [2, 0, 1, 1, 1],
        weights: [1, 2, 3, 4, 5],
        directed: true,
      }),
    );
    expect(error.problem).toBe("duplicate-edge");
    expect(error.message).toBe("edge 2-1 is given more than once");
    expect(error.location).toEqual({ edge: 4, firstEdge: 2 });
  });

  it("refuses lists of different lengths, the wrong number of labels, and nodes out of range", () => {
    expect(
      thrown(() => fromEdgeList({ n: 2, sources: [0], targets: [1, 0], weights: [1], directed: true }))
        .message,
    ).toBe("sources, targets and weights differ in length");
    expect(
      thrown(() => fromEdgeList({ n: 2, sources: [0], targets: [1], weights: [1, 2], directed: true }))
        .message,
    ).toBe("sources, targets and weights differ in length");
    expect(
      thrown(() =>
        fromEdgeList({ n: 2, sources: [0], targets: [1], weights: [1], directed: true, labels: ["a"] }),
      ).message,
    ).toBe("1 labels for 2 nodes");
    const range = thrown(() =>
      fromEdgeList({ n: 3, sources: [0, 1], targets: [1, 3], weights: [1, 1], directed: true }),
    );
    expect(range.message).toBe("node 3 is not in 0..2");
    expect(range.location).toEqual({ edge: 1 });
    // Below the range and between two nodes are out of it too.
    for (const [bad, edge] of [
      [-1, 0],
      [0.5, 1],
    ] as const) {
      const sources = edge === 0 ? [bad, 0] : [0, 1];
      const targets = edge === 0 ? [1, 1] : [1, bad];
      const error = thrown(() => fromEdgeList({ n: 3, sources, targets, weights: [1, 1], directed: true }));
      expect(error.message).toBe(`node ${bad} is not in 0..2`);
      expect(error.location).toEqual({ edge });
    }
  });
});

describe("fromGraphology: direction from the graph's type", () => {
  it("a mixed graph with arcs only is directed, with edges only undirected, with both refused", () => {
    const arcs = new MultiGraph({ type: "mixed" });
    arcs.mergeNode("a");
    arcs.mergeNode("b");
    arcs.addDirectedEdge("a", "b", { weight: 2 });
    expect(fromGraphology(arcs).directed).toBe(true);
    const edges = new MultiGraph({ type: "mixed" });
    edges.mergeNode("a");
    edges.mergeNode("b");
    edges.addUndirectedEdge("a", "b", { weight: 2 });
    expect(fromGraphology(edges).directed).toBe(false);
    edges.addDirectedEdge("b", "a", { weight: 3 });
    const both = thrown(() => fromGraphology(edges));
    expect(both.message).toBe("graph mixes directed and undirected edges");
    expect(both.name).toBe("GraphInputError");
  });
});

describe("small helpers", () => {
  it("density is 0 below two nodes (no possible edge), not 0 / 0", () => {
    expect(density(fromEdgeList({ n: 1, sources: [], targets: [], weights: [], directed: false }))).toBe(0);
    expect(
      density(fromEdgeList({ n: 3, sources: [0], targets: [1], weights: [1], directed: false })),
    ).toBeCloseTo(1 / 3);
  });

  it("thresholdSubgraph's arrays hold exactly the edges kept", () => {
    const g = fromEdgeList({
      n: 3,
      sources: [0, 1, 0],
      targets: [1, 2, 2],
      weights: [1, 2, 3],
      directed: false,
    });
    const sub = thresholdSubgraph(g, 2, "distance");
    expect(Array.from(sub.targets)).toEqual([1, 0, 2, 1]);
    expect(Array.from(sub.weights)).toEqual([1, 1, 2, 2]);
    expect(Array.from(sub.offsets)).toEqual([0, 1, 3, 4]);
  });
});

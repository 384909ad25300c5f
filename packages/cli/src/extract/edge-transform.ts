import { fromEdgeList, GraphInputError, type NegativePolicy, type WeightedGraph } from "@cliquescape/core";
import type { EdgeTransform } from "./run-spec.js";

const FORMULA: Record<Exclude<EdgeTransform, "none">, (w: number) => number> = {
  "one-minus": (w) => 1 - w,
  "neg-log": (w) => -Math.log(w),
  reciprocal: (w) => 1 / w,
};

/**
 * The graph with every edge value replaced by f(w) (1−w, −log w or 1/w), nodes and labels kept. Values that
 * come out infinite or NaN (−log 0, 1/0, log of a negative) are an input error naming the two nodes; values
 * that come out negative follow the negative-weight policy, as read values do.
 */
export function transformEdges(
  graph: WeightedGraph,
  transform: EdgeTransform,
  negative: NegativePolicy,
): WeightedGraph {
  if (transform === "none") return graph;
  const f = FORMULA[transform];
  const sources: number[] = [];
  const targets: number[] = [];
  const weights: number[] = [];
  for (let u = 0; u < graph.n; u++) {
    for (let s = graph.offsets[u]; s < graph.offsets[u + 1]; s++) {
      const v = graph.targets[s];
      if (!graph.directed && v < u) continue; // undirected edges are stored in both rows: take one
      const w = f(graph.weights[s]);
      if (!Number.isFinite(w)) {
        throw new GraphInputError(
          "not-finite",
          `the ${transform} transform turns the weight ${graph.weights[s]} of edge (${nodeName(graph, u)}, ${nodeName(graph, v)}) into ${w}`,
          { row: u, col: v },
        );
      }
      sources.push(u);
      targets.push(v);
      weights.push(w);
    }
  }
  try {
    return fromEdgeList({
      n: graph.n,
      sources,
      targets,
      weights,
      directed: graph.directed,
      labels: graph.labels,
      negative,
    });
  } catch (error) {
    if (error instanceof GraphInputError && error.location.edge !== undefined) {
      const e = error.location.edge;
      throw new GraphInputError(
        error.problem,
        `after the ${transform} transform, edge (${nodeName(graph, sources[e])}, ${nodeName(graph, targets[e])}): ${error.message}`,
        { row: sources[e], col: targets[e] },
      );
    }
    throw error;
  }
}

function nodeName(graph: WeightedGraph, v: number): string {
  return graph.labels ? graph.labels[v] : String(v + 1);
}

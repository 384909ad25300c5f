/**
 * Counts of dimensions 0..3 in larger, denser graphs, checked against numpy (Debian's python3-numpy):
 * test/support/python/tensor_counts.py sums products of adjacency entries with numpy.einsum. These
 * graphs have neighbourhood lists longer than 32, beyond one 32-bit word of a bitset, so they reach code
 * paths the small graphs of the other tests do not.
 */
import {
  countSimplices,
  explicitGrid,
  sweepSimplexCounts,
  type WeightedGraph,
  type WeightSemantics,
} from "@cliquescape/core";
import { describe, expect, it } from "vitest";
import { degeneracy, edgesOf, maxOutDegree } from "../support/graph-ops.js";
import { randomDigraph, randomGraph } from "../support/known-graphs.js";
import { missingPythonModules, runPythonScript } from "../support/python.js";
import { seededRandom } from "../support/random.js";

const missing = missingPythonModules(["numpy"]);
const TOP = 3; // the reference covers dimensions 0..3

function numpyCounts(graph: WeightedGraph, thresholds: Float64Array, semantics: WeightSemantics) {
  const edges = edgesOf(graph);
  return runPythonScript<{ all: number[]; perThreshold: number[][] }>("tensor_counts.py", {
    n: graph.n,
    directed: graph.directed,
    edges: edges.sources.map((u, e) => [u, edges.targets[e], edges.weights[e]]),
    thresholds: Array.from(thresholds),
    semantics,
  });
}

const lowDims = (counts: ArrayLike<number>) => Array.from({ length: TOP + 1 }, (_, k) => counts[k] ?? 0);

const CASES = [
  {
    name: "undirected G(90, 0.55)",
    graph: () => randomGraph(90, 0.55, seededRandom(90), { weighted: true }),
  },
  { name: "directed G(70, 0.5)", graph: () => randomDigraph(70, 0.5, seededRandom(70), { weighted: true }) },
];

describe.skipIf(missing).each(CASES)(
  `$name agrees with numpy.einsum in dimensions 0..3${missing ? ` (skipped: ${missing})` : ""}`,
  (c) => {
    const graph = c.graph();

    it("has lists longer than one 32-bit word (the point of this test)", () => {
      // Undirected cliques grow along a degeneracy order, directed simplices along out-neighbourhoods.
      expect(graph.directed ? maxOutDegree(graph) : degeneracy(graph)).toBeGreaterThan(32);
    });

    it.each<WeightSemantics>(["distance", "similarity"])(
      "counts with all edges, and across a %s grid",
      (semantics) => {
        const grid = explicitGrid([0.1, 0.3, 0.5, 0.7, 0.9, 1], semantics);
        const reference = numpyCounts(graph, grid.thresholds, semantics);
        const full = countSimplices(graph, { maxDim: TOP });
        expect(lowDims(full.counts)).toEqual(reference.all);
        expect(full.truncated).toBe(true); // these graphs have 4-simplices

        const sweep = sweepSimplexCounts(graph, grid, { maxDim: TOP });
        grid.thresholds.forEach((threshold, t) => {
          expect(lowDims(sweep.counts[t]), `sweep at ${threshold}`).toEqual(reference.perThreshold[t]);
          const single = countSimplices(graph, { maxDim: TOP, threshold, semantics });
          expect(lowDims(single.counts), `single count at ${threshold}`).toEqual(reference.perThreshold[t]);
        });
      },
    );

    it("participation totals match: each k-simplex has k+1 members, one source and one sink", () => {
      const reference = numpyCounts(graph, new Float64Array(0), "distance").all;
      const { participation, counts } = countSimplices(graph, { maxDim: TOP, participation: true });
      expect(lowDims(counts)).toEqual(reference);
      const total = (rows: Float64Array[] | undefined, k: number) => rows![k].reduce((a, b) => a + b, 0);
      for (let k = 0; k <= TOP; k++) {
        // Common practice: summing per-node memberships counts each simplex once per vertex.
        expect(total(participation!.member, k), `member, dimension ${k}`).toBe((k + 1) * reference[k]);
        if (graph.directed) {
          expect(total(participation!.source, k), `source, dimension ${k}`).toBe(reference[k]);
          expect(total(participation!.sink, k), `sink, dimension ${k}`).toBe(reference[k]);
        }
      }
    });
  },
);

/**
 * Clique and directed-flag counts checked against networkx (Debian's python3-networkx), run by the test:
 * the same graph, the same thresholds, networkx's own clique enumeration (networkx.enumerate_all_cliques)
 * in test/support/python/clique_counts.py.
 */
import {
  countSimplices,
  explicitGrid,
  fromEdgeList,
  sweepSimplexCounts,
  type WeightedGraph,
  type WeightSemantics,
} from "@cliquescape/core";
import { describe, expect, it } from "vitest";
import { factorial } from "../support/combinatorics.js";
import { degeneracy, significant } from "../support/graph-ops.js";
import { symmetricDigraph } from "../support/known-graphs.js";
import { missingPythonModules, runPythonScript } from "../support/python.js";

interface Reference {
  n: number;
  directed: boolean;
  edges: [number, number, number][];
  all: number[];
  perThreshold: number[][];
}

type GraphSpec =
  | { graph: "karate" }
  | { graph: "gnp"; n: number; p: number; seed: number; directed: boolean };

const missing = missingPythonModules(["networkx"]);
const suite = missing ? describe.skip : describe;
const skipNote = missing ? ` (skipped: ${missing})` : "";

function graphOfReference(reference: Reference): WeightedGraph {
  return fromEdgeList({
    n: reference.n,
    directed: reference.directed,
    sources: reference.edges.map((e) => e[0]),
    targets: reference.edges.map((e) => e[1]),
    weights: reference.edges.map((e) => e[2]),
  });
}

function fetchReference(spec: GraphSpec, thresholds: Float64Array, semantics: WeightSemantics) {
  const reference = runPythonScript<Reference>("clique_counts.py", {
    ...spec,
    thresholds: Array.from(thresholds),
    semantics,
  });
  return { reference, graph: graphOfReference(reference) };
}

/** Compares our counts with networkx's, with all edges and at each threshold (sweep and one-off). */
function checkAgainstNetworkx(spec: GraphSpec, thresholds: number[], semantics: WeightSemantics): Reference {
  const grid = explicitGrid(thresholds, semantics);
  const { reference, graph } = fetchReference(spec, grid.thresholds, semantics);
  expect(significant(countSimplices(graph).counts)).toEqual(reference.all);
  // the TypeScript kernel too: "auto" takes WebAssembly wherever the runtime has it
  expect(significant(countSimplices(graph, { kernel: "typescript" }).counts)).toEqual(reference.all);

  const sweep = sweepSimplexCounts(graph, grid);
  expect(Array.from(sweep.thresholds)).toEqual(Array.from(grid.thresholds));
  grid.thresholds.forEach((threshold, t) => {
    expect(significant(sweep.counts[t]), `sweep at ${threshold}`).toEqual(reference.perThreshold[t]);
    const single = countSimplices(graph, { threshold, semantics });
    expect(significant(single.counts), `single count at ${threshold}`).toEqual(reference.perThreshold[t]);
    // Euler characteristic = alternating sum of the counts (Euler–Poincaré; A. Hatcher, Algebraic Topology, 2002).
    const alternating = reference.perThreshold[t].reduce((sum, c, k) => sum + (k % 2 === 0 ? c : -c), 0);
    expect(sweep.euler[t]).toBe(alternating);
  });
  return reference;
}

suite(`counts agree with networkx${skipNote}`, () => {
  it("Zachary's karate club: cliques per size, with all edges and at interaction-strength thresholds", () => {
    // W. W. Zachary, "An information flow model for conflict and fission in small groups",
    // J. Anthropological Research 33(4), 1977, as networkx.karate_club_graph() ships it (34 members,
    // 78 ties, weight = number of contexts in which two members interacted).
    const reference = checkAgainstNetworkx({ graph: "karate" }, [7, 5, 4, 3, 2, 1], "similarity");
    expect(reference.n).toBe(34);
    expect(reference.edges.length).toBe(78);
    expect(reference.all.length).toBeGreaterThanOrEqual(5); // reaches 4-simplices (5-member cliques)
  });

  it.each([
    { n: 30, p: 0.3, seed: 11, minDegeneracy: 0 },
    { n: 24, p: 0.6, seed: 12, minDegeneracy: 0 },
    // Degeneracy above 32: forward neighbour lists no longer fit one 32-bit word.
    { n: 150, p: 0.35, seed: 31, minDegeneracy: 33 },
  ])("networkx.gnp_random_graph($n, $p, seed=$seed), undirected, distance thresholds with ties", (g) => {
    const { n, p, seed } = g;
    const reference = checkAgainstNetworkx(
      { graph: "gnp", n, p, seed, directed: false },
      [0.1, 0.25, 0.5, 0.63, 0.8, 1],
      "distance",
    );
    expect(reference.all.length).toBeGreaterThanOrEqual(4);
    const graph = graphOfReference(reference);
    expect(degeneracy(graph)).toBeGreaterThanOrEqual(g.minDegeneracy);
    // The symmetric digraph (out-degrees = degrees, here up to ~70) has (k+1)! directed k-simplices per
    // networkx k-clique (common practice).
    const directed = significant(countSimplices(symmetricDigraph(graph)).counts);
    expect(directed).toEqual(reference.all.map((c, k) => c * factorial(k + 1)));
  });

  it.each([
    { n: 16, p: 0.35, seed: 21 },
    { n: 12, p: 0.7, seed: 22 },
  ])("networkx.gnp_random_graph($n, $p, seed=$seed, directed=True), directed flag complex", (g) => {
    const reference = checkAgainstNetworkx(
      { graph: "gnp", ...g, directed: true },
      [0.9, 0.75, 0.5, 0.37, 0.2],
      "similarity",
    );
    expect(reference.all.length).toBeGreaterThanOrEqual(4);
  });
});

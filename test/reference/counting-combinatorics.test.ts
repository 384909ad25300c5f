/**
 * Simplex counts of graphs whose complexes are counted by elementary combinatorics (common practice):
 * every (k+1)-subset of K_n is a k-clique; a transitive tournament orders each subset in exactly one
 * admissible way; a symmetric digraph admits every one of the (k+1)! orders of each clique.
 */
import { countSimplices } from "@cliquescape/core";
import { describe, expect, it } from "vitest";
import { binomial, factorial, fallingFactorial } from "../support/combinatorics.js";
import { significant } from "../support/graph-ops.js";
import {
  completeGraph,
  directedCycle,
  octahedron,
  randomGraph,
  symmetricDigraph,
  transitiveTournament,
} from "../support/known-graphs.js";
import { seededRandom } from "../support/random.js";

const SIZES = [1, 2, 3, 4, 5, 7, 9];

describe("complete graph K_n", () => {
  it.each(SIZES)("K_%i has C(n, k+1) k-simplices and Euler characteristic 1", (n) => {
    const result = countSimplices(completeGraph(n));
    // Common practice: a k-clique of K_n is any (k+1)-subset of its n vertices.
    const expected = Array.from({ length: n }, (_, k) => binomial(n, k + 1));
    expect(significant(result.counts)).toEqual(expected);
    // Its clique complex is the full (n−1)-simplex, which is contractible: χ = 1 (A. Hatcher, Algebraic
    // Topology, 2002, §2.2); equivalently Σ_k (−1)^k C(n, k+1) = 1 (binomial theorem).
    expect(result.euler).toBe(1);
    expect(result.truncated).toBe(false);
  });

  it("maxDim counts dimensions 0..maxDim exactly and reports the cut", () => {
    // Common practice (as the API documents it): a cap below the top dimension truncates.
    const capped = countSimplices(completeGraph(7), { maxDim: 2 });
    expect(Array.from(capped.counts.subarray(0, 3))).toEqual([7, 21, 35]);
    expect(significant(capped.counts).length).toBe(3);
    expect(capped.truncated).toBe(true);
    const enough = countSimplices(completeGraph(7), { maxDim: 6 });
    expect(enough.truncated).toBe(false);
  });
});

describe("transitive tournament", () => {
  it.each(SIZES)("on %i vertices has C(n, k+1) directed k-simplices", (n) => {
    const result = countSimplices(transitiveTournament(n));
    // Common practice: arcs go from smaller to larger index, so each (k+1)-subset has one admissible order.
    const expected = Array.from({ length: n }, (_, k) => binomial(n, k + 1));
    expect(significant(result.counts)).toEqual(expected);
    expect(result.euler).toBe(1);
  });
});

describe("directed cycle", () => {
  it("a cyclic triangle 0→1→2→0 has no 2-simplex", () => {
    // Common practice: (v0, v1, v2) needs v0→v2 as well as v0→v1→v2, which a directed 3-cycle never has.
    expect(significant(countSimplices(directedCycle(3)).counts)).toEqual([3, 3]);
  });
});

describe("symmetric digraph", () => {
  it.each(SIZES)("of K_%i has n!/(n−k−1)! directed k-simplices", (n) => {
    const result = countSimplices(symmetricDigraph(completeGraph(n)));
    // Common practice: (k+1)! orders of each of the C(n, k+1) cliques = ordered (k+1)-tuples of distinct vertices.
    const expected = Array.from({ length: n }, (_, k) => fallingFactorial(n, k + 1));
    expect(significant(result.counts)).toEqual(expected);
  });

  it("of the octahedron has 6, 2·12, 6·8 simplices", () => {
    // Common practice: K_{2,2,2} has 6 vertices, 12 edges and 8 triangles (one per octant) and no K4.
    expect(significant(countSimplices(octahedron()).counts)).toEqual([6, 12, 8]);
    expect(significant(countSimplices(symmetricDigraph(octahedron())).counts)).toEqual([6, 24, 48]);
  });

  it.each([1, 2, 3])(
    "of a seeded G(20, 0.5) (seed %i) has (k+1)! times its k-cliques, with all edges in",
    (seed) => {
      const graph = randomGraph(20, 0.5, seededRandom(seed), { weighted: true });
      const digraph = symmetricDigraph(graph);
      const undirectedCounts = significant(countSimplices(graph).counts);
      const directedCounts = significant(countSimplices(digraph).counts);
      expect(undirectedCounts.length).toBeGreaterThan(3); // the check reaches dimension 3 or more
      expect(directedCounts).toEqual(undirectedCounts.map((c, k) => c * factorial(k + 1)));
    },
  );
});

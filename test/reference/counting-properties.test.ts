/**
 * Property tests (fast-check) of the counting core against plain reference constructions built in
 * test/support, not in the core: the one-pass sweep equals counting the thresholded graph separately,
 * counts are invariant under relabelling, and the symmetric digraph of a graph has (k+1)! directed
 * k-simplices per k-clique (common practice) at every threshold.
 */
import {
  countSimplices,
  densityGrid,
  explicitGrid,
  sweepSimplexCounts,
  type ThresholdGrid,
  type WeightedGraph,
  type WeightSemantics,
} from "@cliquescape/core";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { factorial } from "../support/combinatorics.js";
import { relabel, significant, thresholdSubgraph } from "../support/graph-ops.js";
import { graphOf, symmetricDigraph } from "../support/known-graphs.js";

/** A small graph whose weights come from {1..5}, so that ties are frequent. */
function graphArbitrary(directed: boolean, maxN: number): fc.Arbitrary<WeightedGraph> {
  return fc.integer({ min: 1, max: maxN }).chain((n) => {
    const pairs: [number, number][] = [];
    for (let u = 0; u < n; u++)
      for (let v = directed ? 0 : u + 1; v < n; v++) if (u !== v) pairs.push([u, v]);
    return fc
      .array(fc.option(fc.integer({ min: 1, max: 5 }), { freq: 3 }), {
        minLength: pairs.length,
        maxLength: pairs.length,
      })
      .map((weights) => {
        const present = pairs.filter((_, e) => weights[e] !== null);
        return graphOf({
          n,
          directed,
          sources: present.map((p) => p[0]),
          targets: present.map((p) => p[1]),
          weights: weights.filter((w): w is number => w !== null),
        });
      });
  });
}

const semanticsArbitrary = fc.constantFrom<WeightSemantics>("distance", "similarity");

/** Explicit thresholds on and between the weights (ties) or a density grid. */
function gridArbitrary(graph: WeightedGraph): fc.Arbitrary<ThresholdGrid> {
  const explicit = fc
    .tuple(
      fc.array(
        fc.integer({ min: 0, max: 12 }).map((x) => x / 2),
        { minLength: 1, maxLength: 6 },
      ),
      semanticsArbitrary,
    )
    .map(([values, semantics]) => explicitGrid(values, semantics));
  const byDensity = fc
    .tuple(
      fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 1, maxLength: 6 }),
      semanticsArbitrary,
    )
    .map(([densities, semantics]) => densityGrid(graph, densities, semantics));
  return fc.oneof(explicit, byDensity);
}

const graphAndGrid = (directed: boolean, maxN: number) =>
  graphArbitrary(directed, maxN).chain((graph) => gridArbitrary(graph).map((grid) => ({ graph, grid })));

describe.each([
  { directed: false, maxN: 10 },
  { directed: true, maxN: 7 },
])("directed = $directed", ({ directed, maxN }) => {
  it("the one-pass sweep equals counting each thresholded graph separately", () => {
    fc.assert(
      fc.property(graphAndGrid(directed, maxN), ({ graph, grid }) => {
        const sweep = sweepSimplexCounts(graph, grid);
        expect(Array.from(sweep.thresholds)).toEqual(Array.from(grid.thresholds));
        expect(sweep.counts.length).toBe(grid.thresholds.length);
        grid.thresholds.forEach((threshold, t) => {
          // Reference: the subgraph filtered by test/support (w ≤ W or w ≥ W), counted with all its edges.
          const reference = countSimplices(thresholdSubgraph(graph, threshold, grid.semantics));
          expect(significant(sweep.counts[t])).toEqual(significant(reference.counts));
          expect(sweep.euler[t]).toBe(reference.euler);
          const single = countSimplices(graph, { threshold, semantics: grid.semantics });
          expect(significant(single.counts)).toEqual(significant(reference.counts));
          // Vertices are present at every threshold (the model).
          expect(sweep.counts[t][0]).toBe(graph.n);
        });
      }),
    );
  });

  it("counts only grow along the grid (each threshold's complex contains the previous one's)", () => {
    fc.assert(
      fc.property(graphAndGrid(directed, maxN), ({ graph, grid }) => {
        const { counts } = sweepSimplexCounts(graph, grid);
        for (let t = 1; t < counts.length; t++) {
          counts[t - 1].forEach((c, k) => {
            expect(counts[t][k] ?? 0).toBeGreaterThanOrEqual(c);
          });
        }
      }),
    );
  });

  it("counts and per-node participation are invariant under relabelling vertices", () => {
    const withPermutation = graphArbitrary(directed, maxN).chain((graph) =>
      fc
        .shuffledSubarray([...Array(graph.n).keys()], { minLength: graph.n, maxLength: graph.n })
        .map((perm) => ({ graph, perm })),
    );
    fc.assert(
      fc.property(withPermutation, ({ graph, perm }) => {
        const original = countSimplices(graph, { participation: true });
        const renamed = countSimplices(relabel(graph, perm), { participation: true });
        expect(significant(renamed.counts)).toEqual(significant(original.counts));
        const a = original.participation!;
        const b = renamed.participation!;
        for (const role of ["member", "source", "sink"] as const) {
          expect(b[role] === undefined).toBe(a[role] === undefined);
          a[role]?.forEach((perNode, k) => {
            perNode.forEach((count, v) => {
              expect(b[role]![k][perm[v]], `${role}[${k}][${v}]`).toBe(count);
            });
          });
        }
        if (directed) expect(a.source && a.sink).toBeTruthy();
      }),
    );
  });

  it("maxDim keeps the lower dimensions exact and flags what it cut", () => {
    const withCap = graphArbitrary(directed, maxN).chain((graph) =>
      fc.integer({ min: 0, max: 4 }).map((maxDim) => ({ graph, maxDim })),
    );
    fc.assert(
      fc.property(withCap, ({ graph, maxDim }) => {
        const full = significant(countSimplices(graph).counts);
        const capped = countSimplices(graph, { maxDim });
        expect(significant(capped.counts)).toEqual(full.slice(0, maxDim + 1));
        expect(capped.truncated).toBe(full.length > maxDim + 1);
      }),
    );
  });
});

describe("undirected graph vs its symmetric digraph", () => {
  it("has (k+1)! directed k-simplices per k-clique at every threshold", () => {
    fc.assert(
      fc.property(graphAndGrid(false, 7), ({ graph, grid }) => {
        const undirected = sweepSimplexCounts(graph, grid);
        const directed = sweepSimplexCounts(symmetricDigraph(graph), grid);
        undirected.counts.forEach((counts, t) => {
          // Common practice: every order of a clique's vertices is admissible when all arcs go both ways.
          const expected = significant(counts).map((c, k) => c * factorial(k + 1));
          expect(significant(directed.counts[t])).toEqual(expected);
        });
      }),
    );
  });

  it("each node is in (k+1)! times as many directed k-simplices, k! times as their source or sink", () => {
    fc.assert(
      fc.property(graphArbitrary(false, 7), (graph) => {
        const undirected = countSimplices(graph, { participation: true }).participation!;
        const directed = countSimplices(symmetricDigraph(graph), { participation: true }).participation!;
        undirected.member.forEach((perNode, k) => {
          perNode.forEach((count, v) => {
            // Common practice: of the (k+1)! orders of a clique through v, k! put v first and k! put it last.
            expect(directed.member[k][v]).toBe(count * factorial(k + 1));
            expect(directed.source![k][v]).toBe(count * factorial(k));
            expect(directed.sink![k][v]).toBe(count * factorial(k));
          });
        });
      }),
    );
  });
});

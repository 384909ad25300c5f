/**
 * p-torsion for p ≥ 5: the Moore spaces M(Z/5, 1) and M(Z/7, 1) (a disc whose boundary wraps 5 or 7 times
 * around a circle) as flag complexes. Their homology is in the textbook: H_1 = Z/q, H_2 = 0 over the
 * integers, so over Z/p the Betti numbers are (1, 1, 1) when p divides q and (1, 0, 0) otherwise
 * (A. Hatcher, Algebraic Topology, 2002, Example 2.40 and §3.A, universal coefficients). The Betti numbers
 * thus depend on the prime, which only a correct Z/p arithmetic gets right; with random weights the
 * cohomology reduction meets pivots of 2, 3, 4 (mod 5) and 5 (mod 7) — sums of the wrapped boundary — so
 * a wrong inverse shows here. The persistence barcodes with tied weights are also compared with exact
 * ranks over GF(p) from sympy (test/support/python/persistence_ranks.py).
 */
import {
  bettiAt,
  bettiFromBarcode,
  computeBarcode,
  countSimplices,
  fromEdgeList,
  type WeightedGraph,
} from "@cliquescape/core";
import { describe, expect, it } from "vitest";
import { mooreSpace } from "../support/moore-space.js";
import { missingPythonModules, runPythonScript } from "../support/python.js";
import { seededRandom } from "../support/random.js";

// Every computation here takes milliseconds; a wrong field inverse makes the reduction cancel nothing and
// loop forever, and the time limit turns that into a failure (TimeLimitError) instead of a stalled run.
const timeLimitMs = 10_000;

function weighted(edges: [number, number][], n: number, weight: (i: number) => number): WeightedGraph {
  return fromEdgeList({
    n,
    sources: edges.map((e) => e[0]),
    targets: edges.map((e) => e[1]),
    weights: edges.map((_, i) => weight(i)),
    directed: false,
  });
}

/** How many of the triangles contain each edge. */
function trianglesPerEdge(triangles: [number, number, number][], n: number): Map<number, number> {
  const count = new Map<number, number>();
  for (const [a, b, c] of triangles)
    for (const [u, v] of [
      [a, b],
      [b, c],
      [a, c],
    ])
      count.set(u * n + v, (count.get(u * n + v) ?? 0) + 1);
  return count;
}

describe("Moore spaces M(Z/q, 1) as flag complexes (A. Hatcher, Algebraic Topology, 2002, Example 2.40)", () => {
  for (const q of [5, 7]) {
    const space = mooreSpace(q);
    const graph = weighted(space.edges, space.n, () => 1);

    it(`M(Z/${q}, 1) is the clique complex of its graph: ${space.n} vertices, χ = 1, the circle wrapped ${q} times`, () => {
      // Flag: the graph's cliques are exactly the listed triangles (each is a clique by construction, as
      // the edges come from them; the counts show there are no others and nothing larger).
      const { counts } = countSimplices(graph);
      expect(Array.from(counts)).toEqual([space.n, space.edges.length, space.triangles.length]);
      expect(new Set(space.triangles.map((t) => t.join(","))).size).toBe(space.triangles.length);
      // χ = 1 − 1 + 1 for the cell structure (one 0-cell, one 1-cell, one 2-cell).
      expect(space.n - space.edges.length + space.triangles.length).toBe(1);
      // The 4 circle edges lie in q triangles each (the wrapping), every other edge in 2 (the open disc).
      const perEdge = trianglesPerEdge(space.triangles, space.n);
      const circle = [
        [0, 1],
        [1, 2],
        [2, 3],
        [0, 3],
      ].map(([u, v]) => u * space.n + v);
      for (const [key, count] of perEdge) expect(count, `edge ${key}`).toBe(circle.includes(key) ? q : 2);
    });

    for (const prime of [2, 3, 5, 7]) {
      const expected = prime === q ? [1, 1, 1] : [1, 0, 0];
      it(`over Z/${prime}: Betti numbers (${expected.join(", ")}) by ranks and by barcodes of random weights`, () => {
        expect(bettiAt(graph, { threshold: 1, semantics: "distance", maxDim: 2, prime })).toEqual(expected);
        for (let seed = 1; seed <= 12; seed++) {
          const random = seededRandom(1000 * q + seed);
          const filtered = weighted(space.edges, space.n, () => 1 + random());
          for (const cliqueLayout of ["dense", "sparse"] as const) {
            const barcode = computeBarcode(filtered, {
              semantics: "distance",
              maxDim: 2,
              prime,
              cliqueLayout,
              timeLimitMs,
            });
            expect(bettiFromBarcode(barcode, 2), `seed ${seed} ${cliqueLayout}`).toEqual(expected);
            // Essential classes are the homology of the whole space.
            const essential = barcode.bars.filter((b) => b.death === null).map((b) => b.dim);
            expect(essential).toEqual(expected.flatMap((count, dim) => new Array(count).fill(dim)));
          }
          // Similarity weights walk the edges in the opposite order; the final complex is the same.
          const similar = computeBarcode(filtered, {
            semantics: "similarity",
            maxDim: 2,
            prime,
            timeLimitMs,
          });
          expect(bettiFromBarcode(similar, 1), `seed ${seed} similarity`).toEqual(expected);
        }
      });
    }
  }
});

const missing = missingPythonModules(["networkx", "sympy"]);

describe.skipIf(missing !== null)(
  `M(Z/5, 1) barcodes with tied weights against sympy's ranks over GF(p)${missing ? ` (skipped: ${missing})` : ""}`,
  () => {
    const space = mooreSpace(5);
    for (const seed of [1, 2, 3]) {
      it(`weights 1..6, seed ${seed}: every bar over Z/2, Z/5 and Z/7`, () => {
        const random = seededRandom(seed);
        const edges = space.edges.map(([u, v]): [number, number, number] => [
          u,
          v,
          1 + Math.floor(random() * 6),
        ]);
        const primes = [2, 5, 7];
        const reference = runPythonScript<{ bars: Record<string, [number, number, number | null][]> }>(
          "persistence_ranks.py",
          { n: space.n, edges, max_dim: 2, primes },
        );
        const graph = weighted(space.edges, space.n, (i) => edges[i][2]);
        for (const prime of primes) {
          const ours = computeBarcode(graph, {
            semantics: "distance",
            maxDim: 2,
            prime,
            timeLimitMs,
          }).bars.map((b) => [b.dim, b.birth, b.death]);
          const key = (b: readonly (number | null)[]) => b.join(" ");
          expect(ours.map(key).sort(), `p=${prime}`).toEqual(reference.bars[String(prime)].map(key).sort());
        }
      });
    }
  },
);

/**
 * Barcodes and Betti numbers over Z/5 and Z/7 on clique complexes of 18–30 vertices, against a reference
 * computed outside the project: networkx lists the cliques (`enumerate_all_cliques`), sympy gives exact
 * ranks over GF(p) (`DomainMatrix(..., GF(p)).rank()`), and the bars follow from persistent Betti numbers
 * by the fundamental lemma of persistent homology (H. Edelsbrunner and J. Harer, Computational Topology:
 * An Introduction, 2010, §VII.1) — no matrix reduction, so nothing is shared with the core's algorithm.
 * See test/support/python/persistence_ranks.py for the formulas.
 *
 * Why these sizes: over Z/2 and Z/3 every non-zero coefficient is its own inverse, and on complexes of
 * about ten vertices the reduction's pivots are ±1, so a wrong inverse goes unseen. With 18–30 vertices,
 * tied weights and dense graphs, columns are added to columns many times and pivots take every value of
 * Z/5 and Z/7.
 */
import {
  bettiAt,
  bettiFromBarcode,
  computeBarcode,
  fromEdgeList,
  type WeightedGraph,
} from "@cliquescape/core";
import { describe, expect, it } from "vitest";
import { missingPythonModules, runPythonScript } from "../support/python.js";
import { seededRandom } from "../support/random.js";

interface Reference {
  levels: number[];
  simplices: number[];
  bars: Record<string, [number, number, number | null][]>;
  betti: Record<string, number[][]>;
}

interface Case {
  n: number;
  density: number;
  seed: number;
}

/** G(n, density) with integer weights 1..5: five levels, many ties on purpose. */
function randomWeightedEdges({ n, density, seed }: Case): [number, number, number][] {
  const random = seededRandom(seed);
  const edges: [number, number, number][] = [];
  for (let u = 0; u < n; u++)
    for (let v = u + 1; v < n; v++) if (random() < density) edges.push([u, v, 1 + Math.floor(random() * 5)]);
  return edges;
}

function graphOf(n: number, edges: [number, number, number][]): WeightedGraph {
  return fromEdgeList({
    n,
    sources: edges.map((e) => e[0]),
    targets: edges.map((e) => e[1]),
    weights: edges.map((e) => e[2]),
    directed: false,
  });
}

const byBar = (a: readonly (number | null)[], b: readonly (number | null)[]) =>
  (a[0] as number) - (b[0] as number) ||
  (a[1] as number) - (b[1] as number) ||
  (a[2] ?? Infinity) - (b[2] ?? Infinity);

const missing = missingPythonModules(["networkx", "sympy"]);

describe.skipIf(missing !== null)(
  `barcodes over Z/5 and Z/7 against sympy's ranks over GF(p)${missing ? ` (skipped: ${missing})` : ""}`,
  () => {
    const maxDim = 2;
    const primes = [5, 7];
    const cases: Case[] = [
      { n: 18, density: 0.6, seed: 501 },
      { n: 22, density: 0.5, seed: 502 },
      { n: 26, density: 0.42, seed: 503 },
      { n: 30, density: 0.35, seed: 504 },
    ];
    for (const c of cases) {
      it(`G(${c.n}, ${c.density}) seed ${c.seed}: every bar and the Betti numbers at every level`, () => {
        const edges = randomWeightedEdges(c);
        const reference = runPythonScript<Reference>("persistence_ranks.py", {
          n: c.n,
          edges,
          max_dim: maxDim,
          primes,
        });
        const graph = graphOf(c.n, edges);
        for (const prime of primes) {
          const expected = reference.bars[String(prime)];
          // The sample must carry homology above dimension 0 that is born and dies, or it says little.
          expect(expected.filter((b) => b[0] >= 1 && b[2] !== null).length).toBeGreaterThan(5);
          expect(expected.some((b) => b[0] === 2)).toBe(true);
          for (const cliqueLayout of ["dense", "sparse"] as const) {
            const barcode = computeBarcode(graph, { semantics: "distance", maxDim, prime, cliqueLayout });
            const ours = barcode.bars.map((b) => [b.dim, b.birth, b.death]);
            expect(ours.sort(byBar), `p=${prime} ${cliqueLayout}`).toEqual([...expected].sort(byBar));
          }
          const barcode = computeBarcode(graph, { semantics: "distance", maxDim, prime });
          reference.levels.forEach((threshold, level) => {
            const betti = reference.betti[String(prime)][level];
            expect(
              bettiAt(graph, { threshold, semantics: "distance", maxDim, prime }),
              `t=${threshold}`,
            ).toEqual(betti);
            expect(bettiFromBarcode(barcode, threshold)).toEqual(betti);
          });
        }
      });
    }
  },
);

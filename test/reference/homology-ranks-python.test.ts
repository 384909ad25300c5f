/**
 * Betti numbers of random flag complexes against ranks computed by general-purpose libraries from
 * Debian's packages: sympy (python3-sympy, `DomainMatrix(..., GF(p)).rank()`) over Z/2 and Z/3, and numpy
 * (python3-numpy, `numpy.linalg.matrix_rank`) over the rationals. β_k = #k-simplices − rank ∂_k − rank ∂_{k+1}
 * (common practice). The complexes and boundary matrices are built here by brute force over vertex subsets
 * and tuples, independently of the core. Our largest prime, 65521, is checked exactly against sympy's rank
 * over GF(65521); numpy's rank over Q is checked too, as a second opinion that these small complexes have no
 * 65521-torsion (their torsion orders are tiny; common practice), so Z/65521 stands in for Q here.
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
import { type RandomArcs, randomArcs } from "../support/random-arcs.js";

interface Job {
  rows: number;
  cols: number;
  p: number;
  entries: [number, number, number][];
}

function ranksInPython(jobs: Job[]): number[] {
  return runPythonScript<number[]>("boundary_ranks.py", jobs);
}

type Arcs = RandomArcs;

/** All simplices at a distance threshold, by brute force: subsets (undirected) or tuples (directed). */
function bruteSimplices(arcs: Arcs, threshold: number, topDim: number): number[][][] {
  const adjacent = new Set<number>();
  arcs.sources.forEach((u, i) => {
    if (arcs.weights[i] > threshold) return;
    const v = arcs.targets[i];
    adjacent.add(u * arcs.n + v);
    if (!arcs.directed) adjacent.add(v * arcs.n + u);
  });
  const byDim: number[][][] = Array.from({ length: topDim + 1 }, () => []);
  const extend = (tuple: number[]) => {
    byDim[tuple.length - 1].push([...tuple]);
    if (tuple.length === topDim + 1) return;
    for (let v = 0; v < arcs.n; v++) {
      if (tuple.includes(v)) continue;
      if (!arcs.directed && v < tuple[tuple.length - 1]) continue;
      if (tuple.every((u) => adjacent.has(u * arcs.n + v))) extend([...tuple, v]);
    }
  };
  for (let v = 0; v < arcs.n; v++) extend([v]);
  return byDim;
}

/** Boundary matrix ∂_k as sparse entries: rows are (k−1)-simplices, columns k-simplices, signs (−1)^i. */
function boundaryJob(faces: number[][], cells: number[][], p: number): Job {
  const index = new Map(faces.map((face, i) => [face.join(","), i]));
  const entries: [number, number, number][] = [];
  cells.forEach((cell, c) => {
    cell.forEach((_, i) => {
      const face = cell.filter((__, j) => j !== i);
      entries.push([index.get(face.join(","))!, c, i % 2 === 0 ? 1 : -1]);
    });
  });
  return { rows: faces.length, cols: cells.length, p, entries };
}

const missing = missingPythonModules(["numpy", "sympy"]);

describe.skipIf(missing !== null)(
  `Betti numbers against numpy / sympy ranks${missing ? ` (skipped: ${missing})` : ""}`,
  () => {
    const maxDim = 2;
    const cases: { n: number; p: number; directed: boolean; seed: number }[] = [];
    for (const seed of [1, 2, 3, 4, 5, 6]) cases.push({ n: 9, p: 0.6, directed: false, seed });
    for (const seed of [7, 8, 9, 10]) cases.push({ n: 10, p: 0.75, directed: false, seed });
    for (const seed of [11, 12, 13, 14, 15, 16]) cases.push({ n: 6, p: 0.55, directed: true, seed });

    it("at every weight level, for Z/2, Z/3, Z/65521 (sympy) and Q (numpy)", () => {
      const jobs: Job[] = [];
      const checks: { counts: number[]; ranksAt: number; ours: number[]; label: string }[] = [];
      for (const c of cases) {
        const arcs = randomArcs(c.n, c.p, 4, c.seed, c.directed);
        const graph: WeightedGraph = fromEdgeList(arcs);
        for (const [prime, ourPrime] of [
          [2, 2],
          [3, 3],
          [65521, 65521],
          [0, 65521],
        ]) {
          const barcode = computeBarcode(graph, { semantics: "distance", maxDim, prime: ourPrime });
          for (const threshold of [1, 2, 3, 4]) {
            const simplices = bruteSimplices(arcs, threshold, maxDim + 1);
            const ranksAt = jobs.length;
            for (let k = 1; k <= maxDim + 1; k++)
              jobs.push(boundaryJob(simplices[k - 1], simplices[k], prime));
            const direct = bettiAt(graph, { threshold, semantics: "distance", maxDim, prime: ourPrime });
            expect(bettiFromBarcode(barcode, threshold)).toEqual(direct);
            checks.push({
              counts: simplices.map((s) => s.length),
              ranksAt,
              ours: direct,
              label: `${c.directed ? "directed" : "undirected"} n=${c.n} seed=${c.seed} p=${prime} t=${threshold}`,
            });
          }
        }
      }
      const ranks = ranksInPython(jobs);
      let nonTrivial = 0;
      for (const check of checks) {
        const rank = (k: number) => (k === 0 || k > maxDim + 1 ? 0 : ranks[check.ranksAt + k - 1]);
        const reference = Array.from(
          { length: maxDim + 1 },
          (_, k) => check.counts[k] - rank(k) - rank(k + 1),
        );
        expect(check.ours, check.label).toEqual(reference);
        if (reference[1] > 0 || reference[2] > 0) nonTrivial++;
      }
      // The sample must exercise higher homology, or the comparison says little.
      expect(nonTrivial).toBeGreaterThan(10);
    });
  },
);

/**
 * Expected simplex counts in Erdős–Rényi random graphs: undirected E[#k-cliques in G(n,p)] =
 * C(n,k) p^{C(k,2)} (B. Bollobás, Random Graphs, 2nd ed., 2001) and directed E[#k-simplices] =
 * n!/(n−k−1)! · p^{k(k+1)/2} (derived in test/support/random-graph-moments.ts), checked two ways:
 * exactly, by averaging over every graph on a few vertices, and statistically over seeded samples.
 */
import { countSimplices, fromEdgeList } from "@cliquescape/core";
import { describe, expect, it } from "vitest";
import { binomial, fallingFactorial } from "../support/combinatorics.js";
import { randomDigraph, randomGraph } from "../support/known-graphs.js";
import { seededRandom } from "../support/random.js";
import {
  cliqueCountMoments,
  directedSimplexCountMoments,
  type Moments,
} from "../support/random-graph-moments.js";

/** Every unordered pair (undirected) or ordered pair (directed) of 0..n−1, u ≠ v. */
function allPairs(n: number, directed: boolean): [number, number][] {
  const pairs: [number, number][] = [];
  for (let u = 0; u < n; u++) for (let v = directed ? 0 : u + 1; v < n; v++) if (u !== v) pairs.push([u, v]);
  return pairs;
}

/** Calls `visit` with the edge subset of every graph on n labelled vertices (bit e of mask = pair e). */
function forEveryGraph(
  n: number,
  directed: boolean,
  visit: (edges: [number, number][], mask: number) => void,
) {
  const pairs = allPairs(n, directed);
  for (let mask = 0; mask < 2 ** pairs.length; mask++)
    visit(
      pairs.filter((_, e) => (mask >> e) & 1),
      mask,
    );
}

/** Probability of one particular graph with `edgeCount` of `pairCount` possible edges. */
function graphProbability(p: number, edgeCount: number, pairCount: number): number {
  return p ** edgeCount * (1 - p) ** (pairCount - edgeCount);
}

/** Number of ordered m-tuples (or m-sets, undirected) whose forward pairs are all edges: the definition. */
function bruteForceCount(n: number, directed: boolean, edges: [number, number][], m: number): number {
  const has = new Set(edges.map(([u, v]) => u * n + v));
  const adjacent = (u: number, v: number) => has.has(u * n + v) || (!directed && has.has(v * n + u));
  let count = 0;
  const tuple: number[] = [];
  const extend = (): void => {
    if (tuple.length === m) {
      count++;
      return;
    }
    for (let v = 0; v < n; v++) {
      if (tuple.includes(v) || (!directed && tuple.length > 0 && v < tuple[tuple.length - 1])) continue;
      if (!tuple.every((u) => adjacent(u, v))) continue;
      tuple.push(v);
      extend();
      tuple.pop();
    }
  };
  extend();
  return count;
}

describe("the moment formulas themselves", () => {
  // Self-check of the derivations in random-graph-moments.ts: exact mean and variance by summing over all
  // 2^10 graphs on 5 vertices and all 2^12 digraphs on 4 vertices, counting by the definition.
  it.each([
    { n: 5, directed: false, p: 0.3 },
    { n: 4, directed: true, p: 0.3 },
  ])("match exhaustive enumeration (n = $n, directed = $directed)", ({ n, directed, p }) => {
    const pairCount = allPairs(n, directed).length;
    for (let m = 2; m <= n; m++) {
      let mean = 0;
      let square = 0;
      forEveryGraph(n, directed, (edges) => {
        const x = bruteForceCount(n, directed, edges, m);
        const probability = graphProbability(p, edges.length, pairCount);
        mean += probability * x;
        square += probability * x * x;
      });
      const formula = directed ? directedSimplexCountMoments(n, p, m - 1) : cliqueCountMoments(n, p, m);
      expect(formula.mean).toBeCloseTo(mean, 12);
      expect(formula.variance).toBeCloseTo(square - mean * mean, 12);
    }
  });
});

describe("average counts over every small graph equal the expectation exactly (p = 1/2)", () => {
  // With p = 1/2 every graph is equally likely, so Σ_graphs count = 2^{pairs} · E exactly.
  it("undirected: all 1024 graphs on 5 vertices, Σ #k-cliques = 2^10 C(5,k) 2^{−C(k,2)} (Bollobás 2001)", () => {
    const total = new Float64Array(6);
    forEveryGraph(5, false, (edges) => {
      const graph = fromEdgeList({
        n: 5,
        directed: false,
        sources: edges.map((e) => e[0]),
        targets: edges.map((e) => e[1]),
        weights: edges.map(() => 1),
      });
      countSimplices(graph).counts.forEach((c, k) => {
        total[k + 1] += c;
      });
    });
    for (let k = 1; k <= 5; k++)
      expect(total[k], `${k}-cliques`).toBe(2 ** 10 * binomial(5, k) * 2 ** -binomial(k, 2));
  });

  it("directed: all 4096 digraphs on 4 vertices, Σ #k-simplices = 2^12 (4)_{k+1} 2^{−k(k+1)/2}", () => {
    const total = new Float64Array(4);
    forEveryGraph(4, true, (edges) => {
      const graph = fromEdgeList({
        n: 4,
        directed: true,
        sources: edges.map((e) => e[0]),
        targets: edges.map((e) => e[1]),
        weights: edges.map(() => 1),
      });
      countSimplices(graph).counts.forEach((c, k) => {
        total[k] += c;
      });
    });
    for (let k = 0; k <= 3; k++) {
      expect(total[k], `${k}-simplices`).toBe(
        2 ** 12 * fallingFactorial(4, k + 1) * 2 ** (-(k * (k + 1)) / 2),
      );
    }
  });
});

/**
 * Sample-mean test. The N sampled graphs are independent, so the sample mean of a count X has variance
 * Var X / N, with Var X exact (random-graph-moments.ts). By the central limit theorem,
 * P(|mean − E X| > z·sqrt(Var X / N)) ≈ 2(1 − Φ(z)); z = 4.42 gives ≈ 1.0e-5 per check, so the 8 checks
 * below fail falsely with probability below 1e-4 (union bound). The seeds are fixed, so the outcome is
 * deterministic; the bound says how unlucky a seed would have to be.
 */
const Z = 4.42;
const SAMPLES = 4000;
// The check must be able to fail: the tolerance must stay below this share of the mean (at N = 4000 it is
// 0.3–6 % here), so a systematic error of that size is detected.
const MAX_RELATIVE_TOLERANCE = 0.08;

function checkSampleMeans(
  sample: (random: () => number) => Float64Array,
  moments: (k: number) => Moments,
  dims: number[],
  seed: number,
) {
  const random = seededRandom(seed);
  const sums = new Float64Array(dims.length);
  for (let i = 0; i < SAMPLES; i++) {
    const counts = sample(random);
    dims.forEach((k, d) => {
      sums[d] += counts[k] ?? 0;
    });
  }
  dims.forEach((k, d) => {
    const { mean, variance } = moments(k);
    const tolerance = Z * Math.sqrt(variance / SAMPLES);
    expect(tolerance / mean, `relative tolerance in dimension ${k}`).toBeLessThan(MAX_RELATIVE_TOLERANCE);
    expect(
      Math.abs(sums[d] / SAMPLES - mean),
      `dimension ${k}: mean ${sums[d] / SAMPLES} vs ${mean}`,
    ).toBeLessThan(tolerance);
  });
}

describe("seeded samples match the expected counts within a variance-derived tolerance", () => {
  it("G(40, 0.35): mean #k-cliques = C(40,k) 0.35^{C(k,2)}, k = 2..5 (Bollobás 2001)", () => {
    const n = 40;
    const p = 0.35;
    // dimension d ↔ (d+1)-cliques
    checkSampleMeans(
      (random) => countSimplices(randomGraph(n, p, random)).counts,
      (d) => cliqueCountMoments(n, p, d + 1),
      [1, 2, 3, 4],
      20261202,
    );
  });

  it("directed G(20, 0.4): mean #k-simplices = 20!/(20−k−1)! · 0.4^{k(k+1)/2}, k = 1..4", () => {
    const n = 20;
    const p = 0.4;
    checkSampleMeans(
      (random) => countSimplices(randomDigraph(n, p, random)).counts,
      (k) => directedSimplexCountMoments(n, p, k),
      [1, 2, 3, 4],
      20261203,
    );
  });
});

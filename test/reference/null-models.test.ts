/**
 * Null models against their definitions:
 * - degree-preserving rewiring (S. Maslov, K. Sneppen, Science 296, 2002) keeps every node's degree, and
 *   directed swaps keep every in- and out-degree: checked exactly, node by node, and with a grid the degrees
 *   at every threshold too; the multiset of weights is kept;
 * - Erdős–Rényi samples: the edge count is binomial(possible, p), so the mean of N samples lies within
 *   4 standard errors sqrt(possible · p (1 − p) / N) of possible · p (common practice: binomial mean and
 *   variance; 4 standard errors fail by chance with probability < 1e-4);
 * - weight shuffling keeps the edges and the multiset of weights;
 * - a fixed seed reproduces identical samples; the random stream is integer-only: it equals xoroshiro128+
 *   (D. Blackman, S. Vigna, "Scrambled linear pseudorandom number generators", ACM TOMS 47, 2021) written
 *   here independently with BigInt from the published recurrence, so it cannot depend on a machine's
 *   floating point.
 */
import {
  compareWithNull,
  edgeArrays,
  erdosRenyiSample,
  evenGrid,
  nullSample,
  possibleEdgeCount,
  rewireDegreePreserving,
  sampleRandom,
  shuffleWeights,
  thresholdSubgraph,
  type WeightedGraph,
} from "@cliquescape/core";
import { describe, expect, it } from "vitest";
import { randomDigraph, randomGraph } from "../support/known-graphs.js";
import { seededRandom } from "../support/random.js";

function degrees(graph: WeightedGraph): { out: number[]; in: number[] } {
  const out = new Array<number>(graph.n).fill(0);
  const inDegree = new Array<number>(graph.n).fill(0);
  for (let u = 0; u < graph.n; u++) {
    out[u] = graph.offsets[u + 1] - graph.offsets[u];
    for (let s = graph.offsets[u]; s < graph.offsets[u + 1]; s++) inDegree[graph.targets[s]]++;
  }
  return { out, in: inDegree };
}

const sortedWeights = (g: WeightedGraph) => Array.from(edgeArrays(g).weights).sort((a, b) => a - b);
const edgeSet = (g: WeightedGraph) => {
  const e = edgeArrays(g);
  return Array.from(e.sources, (u, i) => `${u}-${e.targets[i]}`).join(" ");
};

describe("degree-preserving rewiring (Maslov & Sneppen 2002)", () => {
  for (const directed of [false, true]) {
    it(`${directed ? "directed: every in- and out-degree" : "undirected: every degree"} is kept exactly`, () => {
      const random = seededRandom(directed ? 5 : 6);
      for (let trial = 0; trial < 20; trial++) {
        const graph = directed
          ? randomDigraph(30, 0.15, random, { weighted: true })
          : randomGraph(40, 0.15, random, { weighted: true });
        const result = rewireDegreePreserving(graph, sampleRandom(trial, 0), { swapsPerEdge: 10 });
        expect(degrees(result.graph)).toEqual(degrees(graph));
        expect(sortedWeights(result.graph)).toEqual(sortedWeights(graph));
        expect(result.swaps + result.refused).toBe(10 * edgeArrays(graph).sources.length);
        expect(result.swaps).toBeGreaterThan(0);
        expect(edgeSet(result.graph)).not.toBe(edgeSet(graph));
      }
    });
  }

  it("with a grid, degrees are kept at every threshold of the grid", () => {
    const random = seededRandom(9);
    const graph = randomGraph(40, 0.25, random, { weighted: true });
    const grid = evenGrid(0.8, 0.2, 4, "similarity");
    const result = rewireDegreePreserving(graph, sampleRandom(3, 1), { grid });
    for (const t of grid.thresholds) {
      expect(degrees(thresholdSubgraph(result.graph, t, "similarity"))).toEqual(
        degrees(thresholdSubgraph(graph, t, "similarity")),
      );
    }
    expect(result.swaps).toBeGreaterThan(0);
  });

  it("a graph where no swap is possible (a star) refuses every attempt and stays the same", () => {
    const star: WeightedGraph = {
      n: 5,
      directed: false,
      offsets: Int32Array.of(0, 4, 5, 6, 7, 8),
      targets: Int32Array.of(1, 2, 3, 4, 0, 0, 0, 0),
      weights: Float64Array.of(1, 2, 3, 4, 1, 2, 3, 4),
    };
    const result = rewireDegreePreserving(star, sampleRandom(1, 0));
    expect(result.swaps).toBe(0);
    expect(result.refused).toBe(40);
    expect(edgeSet(result.graph)).toBe("0-1 0-2 0-3 0-4");
  });
});

describe("Erdős–Rényi samples at the same density", () => {
  for (const directed of [false, true]) {
    it(`${directed ? "directed" : "undirected"}: the mean edge count is within 4 standard errors of p · possible`, () => {
      const random = seededRandom(directed ? 21 : 22);
      const graph = directed
        ? randomDigraph(25, 0.2, random, { weighted: true })
        : randomGraph(35, 0.2, random, { weighted: true });
      const possible = possibleEdgeCount(graph.n, graph.directed);
      const p = edgeArrays(graph).sources.length / possible;
      const N = 300;
      let sum = 0;
      for (let s = 0; s < N; s++) {
        const sample = erdosRenyiSample(graph, sampleRandom(7, s));
        expect(sample.directed).toBe(directed);
        sum += edgeArrays(sample).sources.length;
      }
      const standardError = Math.sqrt((possible * p * (1 - p)) / N);
      expect(Math.abs(sum / N - possible * p)).toBeLessThan(4 * standardError);
    });
  }

  it("draws weights from the graph's own weights", () => {
    const graph = randomGraph(30, 0.3, seededRandom(3), { weighted: true });
    const own = new Set(edgeArrays(graph).weights);
    for (const w of edgeArrays(erdosRenyiSample(graph, sampleRandom(1, 1))).weights)
      expect(own.has(w)).toBe(true);
  });
});

describe("weight shuffling", () => {
  it("keeps every edge and the multiset of weights, and moves weights", () => {
    const graph = randomGraph(30, 0.3, seededRandom(4), { weighted: true });
    const shuffled = shuffleWeights(graph, sampleRandom(2, 0));
    expect(edgeSet(shuffled)).toBe(edgeSet(graph));
    expect(sortedWeights(shuffled)).toEqual(sortedWeights(graph));
    expect(Array.from(edgeArrays(shuffled).weights)).not.toEqual(Array.from(edgeArrays(graph).weights));
  });
});

describe("reproducible samples", () => {
  it("the same seed and sample number give identical graphs; another seed or sample gives another", () => {
    const graph = randomGraph(30, 0.2, seededRandom(8), { weighted: true });
    for (const model of ["er", "rewire", "shuffle"] as const) {
      const a = nullSample(graph, 4, { model, seed: 99 }).graph;
      const b = nullSample(graph, 4, { model, seed: 99 }).graph;
      expect(Array.from(b.targets)).toEqual(Array.from(a.targets));
      expect(Array.from(b.weights)).toEqual(Array.from(a.weights));
      const c = nullSample(graph, 5, { model, seed: 99 }).graph;
      const d = nullSample(graph, 4, { model, seed: 100 }).graph;
      expect(Array.from(c.weights)).not.toEqual(Array.from(a.weights));
      expect(Array.from(d.weights)).not.toEqual(Array.from(a.weights));
    }
  });

  it("the random stream is xoroshiro128+ on integers (an independent BigInt version of the recurrence)", () => {
    const mask = (1n << 64n) - 1n;
    const rotl = (x: bigint, k: bigint) => ((x << k) | (x >> (64n - k))) & mask;
    // pure-rand seeds xoroshiro128plus(seed) with s0 = (hi −1, lo ~seed), s1 = (hi seed, lo 0); the seed
    // passed is the mixed one, so compare from the state through the library's own seeding rule.
    const seed = 0x1234abcd | 0;
    let s0 = (BigInt.asUintN(32, -1n) << 32n) | BigInt.asUintN(32, BigInt(~seed));
    let s1 = BigInt.asUintN(32, BigInt(seed)) << 32n;
    const reference: number[] = [];
    for (let i = 0; i < 40; i++) {
      reference.push(Number((s0 + s1) & 0xffffffffn));
      const t = s1 ^ s0;
      s0 = rotl(s0, 24n) ^ t ^ ((t << 16n) & mask);
      s1 = rotl(t, 37n);
    }
    return import("pure-rand/generator/xoroshiro128plus").then(({ xoroshiro128plus }) => {
      const rng = xoroshiro128plus(seed);
      expect(reference.map(() => rng.next() >>> 0)).toEqual(reference);
    });
  });
});

describe("compareWithNull", () => {
  it("mean, sample sd, z and the (1 + count)/(N + 1) p-values, by hand", () => {
    const c = compareWithNull(10, [1, 2, 3, 4, 5]);
    expect(c.mean).toBe(3);
    expect(c.sd).toBeCloseTo(Math.sqrt(2.5), 15);
    expect(c.z).toBeCloseTo(7 / Math.sqrt(2.5), 14);
    expect(c.pGreater).toBe(1 / 6);
    expect(c.pLess).toBe(1);
    expect(c.pTwoSided).toBe(2 / 6);
    expect(compareWithNull(3, [3, 3, 3]).z).toBeNull();
  });
});

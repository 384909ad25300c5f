import {
  DEFAULT_FEATURE_CONFIG,
  density,
  fromEdgeList,
  topologicalFeatureNames,
  type WeightedGraph,
} from "@cliquescape/core";
import { describe, expect, it } from "vitest";
import {
  completeGraph,
  randomDigraph,
  randomGraph,
  transitiveTournament,
} from "../../../test/support/known-graphs.js";
import { seededRandom } from "../../../test/support/random.js";
import { graphFeatureNames, graphFeatures } from "./graph-features.js";
import { networkStatisticNames, networkStatistics } from "./network-statistics.js";

function stats(graph: WeightedGraph): Record<string, number> {
  const values = networkStatistics(graph);
  return Object.fromEntries(networkStatisticNames().map((name, i) => [name, values[i]]));
}

describe("networkStatistics", () => {
  it("names its columns with a net_ prefix, once each", () => {
    const names = networkStatisticNames();
    expect(new Set(names).size).toBe(names.length);
    for (const name of names) expect(name).toMatch(/^net_[a-z_]+$/);
    expect(networkStatistics(completeGraph(3)).length).toBe(names.length);
  });

  it("gives the closed forms of a complete graph with equal weights (common practice)", () => {
    const n = 7;
    const w = 0.25;
    const graph = fromEdgeList({ ...edgesOf(completeGraph(n)), weights: new Array(21).fill(w) });
    expect(stats(graph)).toEqual({
      net_nodes: n,
      net_edges: (n * (n - 1)) / 2,
      net_density: 1,
      net_degree_mean: n - 1,
      net_degree_sd: 0,
      net_degree_max: n - 1,
      net_strength_mean: (n - 1) * w,
      net_strength_sd: 0,
      net_strength_max: (n - 1) * w,
      net_weight_mean: w,
      net_weight_sd: 0,
      net_weight_min: w,
      net_weight_max: w,
    });
  });

  it("gives the closed forms of a star with weights 1..k (hand-derived; common practice)", () => {
    // Hub 0 joined to leaves 1..k, leaf i by weight i. n = k + 1 nodes, k edges.
    const k = 5;
    const leaves = Array.from({ length: k }, (_, i) => i + 1);
    const star = fromEdgeList({
      n: k + 1,
      sources: leaves.map(() => 0),
      targets: leaves,
      weights: leaves,
      directed: false,
    });
    const s = stats(star);
    const n = k + 1;
    expect(s.net_density).toBeCloseTo(k / ((n * (n - 1)) / 2), 15); // = 2/n
    expect(s.net_degree_mean).toBeCloseTo((2 * k) / n, 15);
    // Degrees: one k and k ones; population variance = mean of squares − square of mean.
    const degreeVariance = (k * k + k) / n - ((2 * k) / n) ** 2;
    expect(s.net_degree_sd).toBeCloseTo(Math.sqrt(degreeVariance), 12);
    expect(s.net_degree_max).toBe(k);
    // Strengths: the hub k(k+1)/2, leaf i has i; their sum is twice the total weight.
    const total = (k * (k + 1)) / 2;
    expect(s.net_strength_mean).toBeCloseTo((2 * total) / n, 12);
    expect(s.net_strength_max).toBe(total);
    // Weights 1..k are a discrete uniform: mean (k+1)/2, variance (k²−1)/12.
    expect(s.net_weight_mean).toBeCloseTo((k + 1) / 2, 15);
    expect(s.net_weight_sd).toBeCloseTo(Math.sqrt((k * k - 1) / 12), 12);
    expect([s.net_weight_min, s.net_weight_max]).toEqual([1, k]);
  });

  it("counts arcs and in + out degree for directed graphs", () => {
    // The transitive tournament on n nodes has every one of the n(n−1)/2 pairs joined once: density 1/2 of
    // the n(n−1) possible arcs, and every node has in + out = n − 1 (common practice).
    const n = 6;
    const s = stats(transitiveTournament(n));
    expect(s.net_edges).toBe(15);
    expect(s.net_density).toBe(0.5);
    expect([s.net_degree_mean, s.net_degree_sd, s.net_degree_max]).toEqual([n - 1, 0, n - 1]);
    expect(s.net_strength_mean).toBe(n - 1);
  });

  it("agrees with core's own density on random graphs (an independent implementation)", () => {
    const random = seededRandom(5);
    for (const graph of [
      randomGraph(20, 0.3, random, { weighted: true }),
      randomDigraph(15, 0.2, random, { weighted: true }),
    ]) {
      const s = stats(graph);
      expect(s.net_density).toBeCloseTo(density(graph), 14);
      // Handshake lemma: strengths (in + out when directed) sum to twice the total weight (common practice).
      let total = 0;
      for (let i = 0; i < graph.weights.length; i++) total += graph.weights[i];
      const perEdge = graph.directed ? 2 : 1; // undirected rows already hold each edge twice
      expect(s.net_strength_mean * s.net_nodes).toBeCloseTo(total * perEdge, 9);
    }
  });

  it("gives zeros, not NaN, for graphs without nodes or edges", () => {
    const empty = fromEdgeList({ n: 0, sources: [], targets: [], weights: [], directed: false });
    expect(Array.from(networkStatistics(empty))).toEqual(new Array(networkStatisticNames().length).fill(0));
    const isolated = stats(fromEdgeList({ n: 1, sources: [], targets: [], weights: [], directed: false }));
    expect(isolated.net_nodes).toBe(1);
    expect(isolated.net_density).toBe(0);
  });
});

describe("graphFeatures", () => {
  it("appends the network columns to the topological ones when the family is on", () => {
    const axis = { kind: "weight" as const, values: [0.2, 0.5, 0.8] };
    const names = graphFeatureNames(DEFAULT_FEATURE_CONFIG, axis);
    const topological = topologicalFeatureNames(DEFAULT_FEATURE_CONFIG, axis);
    expect(names).toEqual([...topological, ...networkStatisticNames()]);
    expect(new Set(names).size).toBe(names.length);
    const graph = randomGraph(10, 0.5, seededRandom(1), { weighted: true });
    const row = graphFeatures(graph, { config: DEFAULT_FEATURE_CONFIG, axis, semantics: "distance" });
    expect(row.values.length).toBe(names.length);
    expect(Array.from(row.values.subarray(topological.length))).toEqual(Array.from(networkStatistics(graph)));
    const off = {
      ...DEFAULT_FEATURE_CONFIG,
      families: { ...DEFAULT_FEATURE_CONFIG.families, network: false },
    };
    expect(graphFeatureNames(off, axis)).toEqual(topological);
    expect(graphFeatures(graph, { config: off, axis, semantics: "distance" }).values.length).toBe(
      topological.length,
    );
  });
});

/** The edges of an undirected graph, each once, as fromEdgeList takes them. */
function edgesOf(graph: WeightedGraph) {
  const sources: number[] = [];
  const targets: number[] = [];
  for (let u = 0; u < graph.n; u++) {
    for (let s = graph.offsets[u]; s < graph.offsets[u + 1]; s++) {
      if (graph.targets[s] > u) {
        sources.push(u);
        targets.push(graph.targets[s]);
      }
    }
  }
  return { n: graph.n, sources, targets, directed: graph.directed };
}

import { describe, expect, it } from "vitest";
import { seededRandom } from "../../../../test/support/random.js";
import { estimatedCost, idHash, type PlannedGraph, parseShard, partitionGraphs } from "./shard-plan.js";

const loads = (graphs: readonly PlannedGraph[], parts: number[][]) =>
  parts.map((part) => part.reduce((sum, i) => sum + graphs[i].cost, 0));

function randomGraphs(count: number, seed: number): PlannedGraph[] {
  const random = seededRandom(seed);
  // Heavy-tailed costs, with ties (rounded), as graph sizes in a real dataset are.
  return Array.from({ length: count }, (_, i) => ({
    id: `g${String(i).padStart(4, "0")}`,
    cost: Math.round(1 / (0.02 + random()) ** 2),
  }));
}

/** The best makespan by trying every assignment (tiny cases only). */
function optimalMakespan(costs: readonly number[], shards: number): number {
  let best = Number.POSITIVE_INFINITY;
  const load = new Array<number>(shards).fill(0);
  const place = (i: number) => {
    if (i === costs.length) {
      best = Math.min(best, Math.max(...load));
      return;
    }
    for (let s = 0; s < shards; s++) {
      load[s] += costs[i];
      place(i + 1);
      load[s] -= costs[i];
    }
  };
  place(0);
  return best;
}

describe("partitionGraphs", () => {
  it("puts every graph in exactly one shard, each shard in dataset order", () => {
    const graphs = randomGraphs(1000, 7);
    for (const n of [1, 2, 3, 4, 7, 64, 1500]) {
      const parts = partitionGraphs(graphs, n);
      expect(parts).toHaveLength(n);
      const seen = parts.flat().sort((a, b) => a - b);
      expect(seen).toEqual(graphs.map((_, i) => i));
      for (const part of parts) expect([...part].sort((a, b) => a - b)).toEqual(part);
    }
  });

  it("is deterministic and does not depend on the order of the dataset's rows", () => {
    const graphs = randomGraphs(500, 8);
    const byId = (g: readonly PlannedGraph[], parts: number[][]) =>
      parts.map((part) => part.map((i) => g[i].id).sort());
    const once = byId(graphs, partitionGraphs(graphs, 5));
    expect(byId(graphs, partitionGraphs(graphs, 5))).toEqual(once);
    const shuffled = [...graphs].reverse();
    expect(byId(shuffled, partitionGraphs(shuffled, 5))).toEqual(once);
  });

  it("balances by cost within Graham's list-scheduling bound: makespan ≤ total/N + (1 − 1/N)·max cost", () => {
    // Graham, "Bounds for certain multiprocessing anomalies", Bell System Tech. J. 45, 1966 (any list order).
    for (const seed of [1, 2, 3]) {
      const graphs = randomGraphs(300, seed);
      const total = graphs.reduce((s, g) => s + g.cost, 0);
      const largest = Math.max(...graphs.map((g) => g.cost));
      for (const n of [2, 4, 16]) {
        const makespan = Math.max(...loads(graphs, partitionGraphs(graphs, n)));
        expect(makespan).toBeLessThanOrEqual(total / n + (1 - 1 / n) * largest + 1e-9);
      }
    }
  });

  it("is within Graham's LPT bound (4/3 − 1/(3N)) of the optimum found by exhaustive search", () => {
    // Graham, "Bounds on multiprocessing timing anomalies", SIAM J. Appl. Math. 17, 1969, Theorem 2.
    const random = seededRandom(11);
    for (let trial = 0; trial < 60; trial++) {
      const count = 3 + Math.floor(random() * 6);
      const shards = 2 + Math.floor(random() * 2);
      const graphs = Array.from({ length: count }, (_, i) => ({
        id: `t${i}`,
        cost: 1 + Math.floor(random() * 20),
      }));
      const lpt = Math.max(...loads(graphs, partitionGraphs(graphs, shards)));
      const best = optimalMakespan(
        graphs.map((g) => g.cost),
        shards,
      );
      expect(lpt).toBeLessThanOrEqual((4 / 3 - 1 / (3 * shards)) * best + 1e-9);
    }
  });

  it("equal costs: shard sizes differ by at most one", () => {
    const graphs = Array.from({ length: 37 }, (_, i) => ({ id: `e${i}`, cost: 5 }));
    const sizes = partitionGraphs(graphs, 4).map((p) => p.length);
    expect(Math.max(...sizes) - Math.min(...sizes)).toBeLessThanOrEqual(1);
    expect(sizes.reduce((a, b) => a + b, 0)).toBe(37);
  });

  it("equal costs: a dataset whose rows alternate between kinds gives each shard a mix, not one kind", () => {
    // Rows as a study lists them (each subject's runs in turn). Dealt out in id order, shard 0 of 2 got every
    // "rest" graph and shard 1 every "task" graph (and with 3 kinds and 3 shards, one kind each); when the
    // kinds differ in cost, one shard then runs far longer. In a random share of n = 500 of the N graphs, the
    // count of a kind with K = 500 graphs is hypergeometric: mean nK/N, variance n(K/N)(1 − K/N)(N − n)/(N − 1)
    // (common practice; 7.9² for two shards, 8.6² for three). The bound is 5 standard deviations.
    const kinds = ["rest", "task", "memory"];
    for (const k of [2, 3]) {
      const graphs = Array.from({ length: 500 * k }, (_, i) => ({
        id: `sub-${String(Math.floor(i / k)).padStart(3, "0")}_${kinds[i % k]}`,
        cost: 4087975,
      }));
      const parts = partitionGraphs(graphs, k);
      const N = 500 * k;
      const expected = (500 * 500) / N;
      const spread = 5 * Math.sqrt(((500 * 500) / N) * (1 - 500 / N) * ((N - 500) / (N - 1)));
      for (const part of parts) {
        expect(part.length).toBe(500);
        for (const kind of kinds.slice(0, k)) {
          const count = part.filter((i) => graphs[i].id.endsWith(kind)).length;
          expect(Math.abs(count - expected)).toBeLessThan(spread);
        }
      }
    }
  });

  it("refuses a shard count that is not a positive integer", () => {
    expect(() => partitionGraphs([], 0)).toThrow(/positive integer/);
    expect(() => partitionGraphs([], 1.5)).toThrow(/positive integer/);
  });
});

describe("idHash", () => {
  it("is 32-bit FNV-1a: the reference's test vectors", () => {
    // FNV-1a, 32 bits: offset basis 2166136261, prime 16777619 (Fowler, Noll, Vo; IETF
    // draft-eastlake-fnv). Vectors recalled from memory of the FNV reference test suite: "" → 0x811c9dc5,
    // "a" → 0xe40c292c, "foobar" → 0xbf9cf968.
    expect(idHash("")).toBe(0x811c9dc5);
    expect(idHash("a")).toBe(0xe40c292c);
    expect(idHash("foobar")).toBe(0xbf9cf968);
  });
});

describe("estimatedCost", () => {
  it("is the exact simplex count of a complete graph (its clique complex is the full simplex)", () => {
    // A full (n−1)-simplex has C(n, k+1) faces of dimension k (common practice; Hatcher, Algebraic
    // Topology, 2002, §2.1). Here p = 1, so the expectation is exact.
    const binomial = (n: number, k: number) => {
      let r = 1;
      for (let i = 1; i <= k; i++) r = (r * (n - k + i)) / i;
      return r;
    };
    for (const [n, topDim] of [
      [10, 3],
      [7, 5],
      [30, 2],
    ]) {
      let faces = 0;
      for (let k = 0; k <= topDim; k++) faces += binomial(n, k + 1);
      expect(estimatedCost({ nodes: n, edges: binomial(n, 2), directed: false }, topDim)).toBeCloseTo(
        faces,
        6,
      );
    }
  });

  it("complete digraph: every ordered tuple is a directed flag simplex, n!/(n−k−1)! of dimension k", () => {
    const n = 8;
    const expected = n + n * (n - 1) + n * (n - 1) * (n - 2) + n * (n - 1) * (n - 2) * (n - 3);
    expect(estimatedCost({ nodes: n, edges: n * (n - 1), directed: true }, 3)).toBe(expected);
  });

  it("grows with density and with size; an unreadable graph costs 1", () => {
    const sparse = estimatedCost({ nodes: 100, edges: 500, directed: false }, 3);
    const dense = estimatedCost({ nodes: 100, edges: 4000, directed: false }, 3);
    const bigger = estimatedCost({ nodes: 200, edges: 4000, directed: false }, 3);
    expect(dense).toBeGreaterThan(sparse);
    expect(dense).toBeGreaterThan(bigger); // same edges spread over more nodes: fewer cliques
    expect(estimatedCost(null, 3)).toBe(1);
    expect(estimatedCost({ nodes: 0, edges: 0, directed: false }, 3)).toBe(0);
  });
});

describe("parseShard", () => {
  it("reads I/N counted from 0 and refuses the rest", () => {
    expect(parseShard("0/4")).toEqual({ index: 0, count: 4 });
    expect(parseShard("3/4")).toEqual({ index: 3, count: 4 });
    expect(() => parseShard("4/4")).toThrow(/below N/);
    expect(() => parseShard("1/0")).toThrow(/at least 1/);
    expect(() => parseShard("a/4")).toThrow(/expected I\/N/);
    expect(() => parseShard("-1/4")).toThrow(/expected I\/N/);
  });
});

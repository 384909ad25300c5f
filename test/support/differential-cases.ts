/**
 * Seeded small graphs of many shapes for the differential tests: sparse and dense random graphs, complete
 * graphs, random geometric graphs, powers of cycles, grids, complete bipartite graphs, hubs, empty and
 * tiny graphs, directed graphs with and without reciprocal arcs; weights distinct or with heavy ties.
 * Each case names everything needed to rebuild it, so a failure can be reproduced from its description.
 */
import type { EdgeList } from "./known-graphs.js";
import { type Random, seededRandom } from "./random.js";

export type Shape =
  | "sparse"
  | "dense"
  | "complete"
  | "geometric"
  | "cycle-power"
  | "grid"
  | "bipartite"
  | "hub"
  | "tiny"
  | "thresholded";

export type Ties = "distinct" | "few-levels" | "all-equal";

export interface DifferentialCase {
  index: number;
  seed: number;
  /** A generated shape, or where the graph came from (a sentinel file). */
  shape: Shape | string;
  ties: Ties;
  semantics: "distance" | "similarity";
  prime: number;
  /** Highest homology dimension asked for (the worker lowers it to keep the complex small). */
  maxDim: number;
  graph: EdgeList;
  /** Thresholds to compare at: distinct weights, one before the first and one past the last. */
  thresholds: number[];
}

const SHAPES: Shape[] = [
  "sparse",
  "dense",
  "complete",
  "geometric",
  "cycle-power",
  "grid",
  "bipartite",
  "hub",
  "tiny",
  "thresholded",
];

/** `count` cases from `baseSeed`: directed ones when `directed`. */
export function differentialCases(count: number, baseSeed: number, directed: boolean): DifferentialCase[] {
  const cases: DifferentialCase[] = [];
  for (let index = 0; index < count; index++) {
    const seed = baseSeed + index;
    const random = seededRandom(seed);
    const shape = SHAPES[index % SHAPES.length];
    const ties: Ties = pick(random, ["distinct", "distinct", "few-levels", "few-levels", "all-equal"]);
    const semantics = random() < 0.5 ? "distance" : "similarity";
    const prime = pick(random, [2, 2, 3, 5, 7]);
    const maxDim = 1 + Math.floor(random() * 5);
    const pairs = shapePairs(shape, random, directed);
    const graph = weighted(pairs, ties, random, directed);
    cases.push({
      index,
      seed,
      shape,
      ties,
      semantics,
      prime,
      maxDim,
      graph,
      thresholds: thresholdsOf(graph.weights),
    });
  }
  return cases;
}

/** One line naming a case, for failure messages. */
export function describeCase(c: DifferentialCase): string {
  const m = c.graph.sources.length;
  return `case ${c.index} (seed ${c.seed}: ${c.shape}, ${c.graph.directed ? "directed" : "undirected"}, n=${c.graph.n}, m=${m}, ${c.ties} weights, ${c.semantics}, Z/${c.prime}, maxDim ≤ ${c.maxDim})`;
}

interface Pairs {
  n: number;
  pairs: [number, number][];
}

function shapePairs(shape: Shape, random: Random, directed: boolean): Pairs {
  const between = (lo: number, hi: number) => lo + Math.floor(random() * (hi - lo + 1));
  switch (shape) {
    case "sparse":
      return erdosRenyi(between(5, 40), 0.05 + 0.25 * random(), random, directed);
    case "dense":
      return erdosRenyi(between(5, directed ? 12 : 22), 0.5 + 0.5 * random(), random, directed);
    case "complete":
      return erdosRenyi(between(2, directed ? 8 : 18), 1, random, directed);
    case "thresholded": {
      // A dense graph with only its strongest edges kept: what a user's threshold leaves.
      const g = erdosRenyi(between(8, 30), 1, random, directed);
      const keep = 0.1 + 0.5 * random();
      return { n: g.n, pairs: g.pairs.filter(() => random() < keep) };
    }
    case "geometric": {
      const n = between(6, 35);
      const radius = 0.2 + 0.3 * random();
      const x = Array.from({ length: n }, () => random());
      const y = Array.from({ length: n }, () => random());
      const pairs: [number, number][] = [];
      for (let u = 0; u < n; u++)
        for (let v = directed ? 0 : u + 1; v < n; v++)
          if (u !== v && Math.hypot(x[u] - x[v], y[u] - y[v]) < radius && (!directed || random() < 0.6))
            pairs.push([u, v]);
      return { n, pairs };
    }
    case "cycle-power": {
      // C_n^k: edges between vertices at cyclic distance ≤ k (spheres and wedges of spheres appear).
      const n = between(5, 24);
      const k = between(1, Math.max(1, Math.floor((n - 1) / 2)));
      const pairs: [number, number][] = [];
      for (let u = 0; u < n; u++)
        for (let d = 1; d <= k; d++) {
          const v = (u + d) % n;
          if (u < v || d * 2 !== n) pairs.push(directed && random() < 0.5 ? [v, u] : [u, v]);
        }
      return { n, pairs: dedupe(pairs, directed) };
    }
    case "grid": {
      const a = between(2, 6);
      const b = between(2, 6);
      const id = (i: number, j: number) => i * b + j;
      const pairs: [number, number][] = [];
      for (let i = 0; i < a; i++)
        for (let j = 0; j < b; j++) {
          if (i + 1 < a) pairs.push([id(i, j), id(i + 1, j)]);
          if (j + 1 < b) pairs.push([id(i, j), id(i, j + 1)]);
          if (i + 1 < a && j + 1 < b && random() < 0.5) pairs.push([id(i, j), id(i + 1, j + 1)]);
        }
      return {
        n: a * b,
        pairs: directed ? pairs.map(([u, v]) => (random() < 0.5 ? [v, u] : [u, v])) : pairs,
      };
    }
    case "bipartite": {
      const a = between(1, 6);
      const b = between(1, 6);
      const pairs: [number, number][] = [];
      for (let u = 0; u < a; u++)
        for (let v = a; v < a + b; v++) pairs.push(directed && random() < 0.5 ? [v, u] : [u, v]);
      return { n: a + b, pairs };
    }
    case "hub": {
      // A hub joined to a ring and to some chords: long cycles through one high-degree vertex.
      const n = between(4, 30);
      const pairs: [number, number][] = [];
      for (let v = 1; v < n; v++) {
        if (random() < 0.7) pairs.push([0, v]);
        if (v + 1 < n) pairs.push([v, v + 1]);
      }
      if (n > 3) pairs.push([n - 1, 1]);
      return { n, pairs: dedupe(pairs, directed) };
    }
    case "tiny": {
      const n = between(0, 4);
      return erdosRenyi(n, random(), random, directed);
    }
  }
}

function erdosRenyi(n: number, p: number, random: Random, directed: boolean): Pairs {
  const pairs: [number, number][] = [];
  for (let u = 0; u < n; u++)
    for (let v = directed ? 0 : u + 1; v < n; v++) if (u !== v && random() < p) pairs.push([u, v]);
  return { n, pairs };
}

function dedupe(pairs: [number, number][], directed: boolean): [number, number][] {
  const seen = new Set<string>();
  return pairs.filter(([u, v]) => {
    const key = directed ? `${u},${v}` : `${Math.min(u, v)},${Math.max(u, v)}`;
    if (u === v || seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}

function weighted({ n, pairs }: Pairs, ties: Ties, random: Random, directed: boolean): EdgeList {
  const levels = 2 + Math.floor(random() * 3);
  const weight = () =>
    ties === "distinct" ? 0.05 + random() : ties === "few-levels" ? 1 + Math.floor(random() * levels) : 1;
  return {
    n,
    directed,
    sources: pairs.map((p) => p[0]),
    targets: pairs.map((p) => p[1]),
    weights: pairs.map(weight),
  };
}

/** About `most` distinct weights (all when fewer), one before and one past them all. */
export function thresholdsOf(weights: number[], most = 12): number[] {
  const distinct = [...new Set(weights)].sort((a, b) => a - b);
  if (distinct.length === 0) return [1];
  const step = Math.ceil(distinct.length / most);
  const sampled = distinct.filter((_, i) => i % step === 0 || i === distinct.length - 1);
  return [distinct[0] / 2, ...sampled, distinct[distinct.length - 1] * 2];
}

function pick<T>(random: Random, items: readonly T[]): T {
  return items[Math.floor(random() * items.length)];
}

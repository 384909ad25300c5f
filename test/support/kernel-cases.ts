/**
 * Seeded graphs for comparing the two plain-counting kernels (WebAssembly and TypeScript): the small shapes
 * of the differential cases, and wider ones whose local universes span several words in both kernels
 * (lists of 65–400 vertices, candidate sets of more than 64 members, planted cliques counted in closed
 * form, hubs), each with a dimension cap, a budget or a threshold that sends it through the kernels'
 * truncation, budget and masking paths.
 */
import { differentialCases } from "./differential-cases.js";
import type { EdgeList } from "./known-graphs.js";
import { type Random, seededRandom } from "./random.js";

export interface KernelCase {
  index: number;
  seed: number;
  shape: string;
  graph: EdgeList;
  /** Dimension cap, or null for none. */
  maxDim: number | null;
  budget: number;
  /** Count only edges present at this threshold (distance semantics), or null for all edges. */
  threshold: number | null;
  /** Also count at budget = total and total − 1 (both kernels must stop exactly past the budget). */
  budgetEdges: boolean;
}

const WIDE_SHAPES = ["wide-random", "planted-clique", "hub", "multipartite"] as const;

/** `small` cases from the differential generator, then `wide` larger ones, half of each directed. */
export function kernelCases(small: number, wide: number, baseSeed: number): KernelCase[] {
  const cases: KernelCase[] = [];
  const half = Math.ceil(small / 2);
  for (const directed of [false, true]) {
    for (const c of differentialCases(half, baseSeed + (directed ? 50_000 : 0), directed)) {
      const random = seededRandom(c.seed ^ 0x5bd1e995);
      const r = random();
      cases.push({
        index: cases.length,
        seed: c.seed,
        shape: `small ${c.shape}`,
        graph: c.graph,
        maxDim: r < 0.4 ? null : Math.floor(random() * 7),
        budget: 5e6,
        threshold: random() < 0.3 ? c.thresholds[Math.floor(random() * c.thresholds.length)] : null,
        budgetEdges: random() < 0.2,
      });
    }
  }
  for (let i = 0; i < wide; i++) {
    const seed = baseSeed + 100_000 + i;
    const random = seededRandom(seed);
    const shape = WIDE_SHAPES[i % WIDE_SHAPES.length];
    const directed = i % 8 >= 4;
    const { graph, maxDim } = wideGraph(shape, directed, random);
    cases.push({
      index: cases.length,
      seed,
      shape: `${shape} ${directed ? "directed" : "undirected"}`,
      graph,
      maxDim,
      budget: 4e6,
      threshold: random() < 0.25 ? 0.3 + 0.7 * random() : null,
      budgetEdges: random() < 0.15,
    });
  }
  return cases;
}

/** A graph of one wide shape with a dimension cap that keeps its count to a few million simplices. */
function wideGraph(shape: (typeof WIDE_SHAPES)[number], directed: boolean, random: Random) {
  const between = (lo: number, hi: number) => lo + Math.floor(random() * (hi - lo + 1));
  const pairs = new Set<number>();
  let n = 0;
  const add = (u: number, v: number) => {
    if (u === v) return;
    pairs.add(directed || u < v ? u * 4096 + v : v * 4096 + u);
  };
  const er = (p: number) => {
    for (let u = 0; u < n; u++) for (let v = directed ? 0 : u + 1; v < n; v++) if (random() < p) add(u, v);
  };
  let maxDim: number | null;
  switch (shape) {
    case "wide-random": // lists of 65–250 vertices: two to four 64-bit words
      n = between(90, 300);
      er(directed ? 0.3 + 0.5 * random() : 0.4 + 0.4 * random());
      maxDim = between(1, directed ? 4 : 5);
      break;
    case "planted-clique": {
      // a sparse graph with a clique of 20–100 vertices: closed-form subtrees, sets of > 64 members
      n = between(100, 260);
      er(0.02 + 0.08 * random());
      const k = between(20, 100);
      const members = shuffled(n, random).slice(0, k);
      for (const u of members)
        for (const v of members) if (u !== v && (!directed || random() < 0.6)) add(u, v);
      maxDim = directed ? between(1, 4) : k > 60 ? between(1, 4) : random() < 0.5 ? null : between(2, 8);
      break;
    }
    case "hub": {
      // hubs joined to most vertices over a sparser periphery: one very wide universe per hub
      n = between(120, 400);
      er(0.05 + 0.1 * random());
      const hubs = between(1, 4);
      for (let h = 0; h < hubs; h++) for (let v = 0; v < n; v++) if (random() < 0.9) add(h, v);
      maxDim = random() < 0.3 ? null : between(2, 6);
      break;
    }
    case "multipartite": {
      // complete multipartite graphs: many candidate sets that are almost, but not, cliques
      const parts = between(3, 12);
      const size = between(6, 30);
      n = parts * size;
      for (let u = 0; u < n; u++)
        for (let v = 0; v < n; v++)
          if (Math.floor(u / size) !== Math.floor(v / size) && (!directed || random() < 0.5)) add(u, v);
      maxDim = between(1, directed ? 3 : 4);
      break;
    }
  }
  const sources: number[] = [];
  const targets: number[] = [];
  for (const key of [...pairs].sort((a, b) => a - b)) {
    sources.push(Math.floor(key / 4096));
    targets.push(key % 4096);
  }
  const graph: EdgeList = { n, directed, sources, targets, weights: sources.map(() => random()) };
  return { graph, maxDim };
}

function shuffled(n: number, random: Random): number[] {
  const order = Array.from({ length: n }, (_, i) => i);
  for (let i = n - 1; i > 0; i--) {
    const j = Math.floor(random() * (i + 1));
    [order[i], order[j]] = [order[j], order[i]];
  }
  return order;
}

/** One line naming a case, for failure messages. */
export function describeKernelCase(c: KernelCase): string {
  return `case ${c.index} (seed ${c.seed}: ${c.shape}, n=${c.graph.n}, m=${c.graph.sources.length}, maxDim ${c.maxDim ?? "none"}, threshold ${c.threshold ?? "none"}, budget ${c.budget})`;
}

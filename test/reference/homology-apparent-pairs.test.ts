/**
 * Apparent pairs of zero persistence, found by brute force from their definition and compared with the
 * barcode's `apparentPairs` counter and its zero-length bars.
 *
 * Definition (the 2021 paper on Vietoris–Rips barcodes in J. Appl. Comput. Topology 5, its section on
 * apparent pairs; recalled from memory): in a filtration with a total order on simplices, (σ, τ) is an apparent pair when τ is the
 * earliest coface of σ and σ is the latest facet of τ; every apparent pair is a persistence pair of the
 * filtration. Here only pairs with f(σ) = f(τ) count (zero persistence), as `BarcodeStats.apparentPairs`
 * documents. The total order is the one `computeBarcode` documents: value, then dimension, then the
 * combinatorial number system index Σ C(v_i, i + 1) of the ascending vertices (D. E. Knuth, The Art of
 * Computer Programming, vol. 4A, 2011, §7.2.1.3).
 *
 * A simplex that opens an apparent pair is positive, so it is never a cleared column: the counter is the
 * number of apparent pairs, whatever else the reduction skips. The cliques are listed here by brute force
 * over vertex subsets, independently of the code under test.
 *
 * The same brute-force pairs also bound the `columnAdditions` counter from below (see additionLowerBound):
 * its exact value depends on the order of additions, but a column whose pivot must move needs at least one.
 */
import { computeBarcode, fromEdgeList } from "@cliquescape/core";
import { describe, expect, it } from "vitest";
import { binomial } from "../support/combinatorics.js";
import { seededRandom } from "../support/random.js";

interface Simplex {
  vertices: number[];
  f: number;
  key: number;
}

/** Every clique of 2 … maxSize vertices of the graph given by its weight matrix (Infinity: no edge). */
function cliques(n: number, w: number[][], maxSize: number): Simplex[][] {
  const bySize: Simplex[][] = Array.from({ length: maxSize + 1 }, () => []);
  const extend = (vertices: number[], f: number) => {
    if (vertices.length >= 2) {
      const key = vertices.reduce((sum, v, i) => sum + binomial(v, i + 1), 0);
      bySize[vertices.length].push({ vertices, f, key });
    }
    if (vertices.length === maxSize) return;
    for (let v = (vertices.at(-1) ?? -1) + 1; v < n; v++) {
      let g = f;
      let clique = true;
      for (const u of vertices) {
        if (w[u][v] === Infinity) clique = false;
        else g = Math.max(g, w[u][v]);
      }
      if (clique) extend([...vertices, v], g);
    }
  };
  extend([], Number.NEGATIVE_INFINITY);
  return bySize;
}

const before = (a: Simplex, b: Simplex) => a.f < b.f || (a.f === b.f && a.key < b.key);
const isFace = (small: number[], big: number[]) => small.every((v) => big.includes(v));

/** The zero-persistence apparent pairs (σ, τ) with σ of dimension d, for d = 1 … maxDim. */
function apparentPairs(bySize: Simplex[][], maxDim: number): Map<number, [Simplex, Simplex][]> {
  const pairs = new Map<number, [Simplex, Simplex][]>();
  for (let d = 1; d <= maxDim; d++) {
    const found: [Simplex, Simplex][] = [];
    for (const sigma of bySize[d + 1]) {
      const cofaces = bySize[d + 2].filter((t) => isFace(sigma.vertices, t.vertices));
      if (cofaces.length === 0) continue;
      const tau = cofaces.reduce((a, b) => (before(b, a) ? b : a));
      if (tau.f !== sigma.f) continue;
      const facets = bySize[d + 1].filter((s) => isFace(s.vertices, tau.vertices));
      const latest = facets.reduce((a, b) => (before(a, b) ? b : a));
      if (latest === sigma) found.push([sigma, tau]);
    }
    pairs.set(d, found);
  }
  return pairs;
}

/**
 * Persistence pairs by the standard algorithm over Z/2 (H. Edelsbrunner and J. Harer, Computational
 * Topology, 2010, §VII.1): boundary columns in filtration order, each reduced by adding earlier columns
 * with the same lowest entry. Returns the partner of each simplex, as "size:key" → simplex.
 */
function persistencePartners(bySize: Simplex[][], n: number): Map<string, Simplex> {
  const all: { s: Simplex; dim: number }[] = [];
  for (let v = 0; v < n; v++) all.push({ s: { vertices: [v], f: 0, key: v }, dim: 0 });
  for (let size = 2; size < bySize.length; size++)
    for (const s of bySize[size]) all.push({ s, dim: size - 1 });
  all.sort((a, b) => a.s.f - b.s.f || a.dim - b.dim || a.s.key - b.s.key);
  const index = new Map(all.map((x, i) => [`${x.s.vertices}`, i]));
  const columns = all.map((x) =>
    x.dim === 0
      ? new Set<number>()
      : new Set(x.s.vertices.map((_, i) => index.get(`${x.s.vertices.filter((_, j) => j !== i)}`) as number)),
  );
  const low = (c: Set<number>) => (c.size === 0 ? -1 : Math.max(...c));
  const owner = new Map<number, number>();
  const partners = new Map<string, Simplex>();
  columns.forEach((column, j) => {
    for (let l = low(column); l >= 0 && owner.has(l); l = low(column)) {
      for (const r of columns[owner.get(l) as number]) {
        if (column.has(r)) column.delete(r);
        else column.add(r);
      }
    }
    const l = low(column);
    if (l < 0) return;
    owner.set(l, j);
    partners.set(`${all[l].s.vertices}`, all[j].s);
    partners.set(`${all[j].s.vertices}`, all[l].s);
  });
  return partners;
}

/**
 * Emergent pairs (the same paper, as above; recalled from memory): a positive σ, not in an apparent pair,
 * whose partner is its earliest coface, entering with it. The reduction pairs those without building
 * their columns, and counts them.
 */
function emergentPairs(
  bySize: Simplex[][],
  n: number,
  maxDim: number,
  apparent: Map<number, [Simplex, Simplex][]>,
) {
  const partners = persistencePartners(bySize, n);
  const counts = new Map<number, number>();
  for (let d = 1; d <= maxDim; d++) {
    const inApparent = new Set((apparent.get(d) ?? []).map(([sigma]) => sigma));
    let count = 0;
    for (const sigma of bySize[d + 1]) {
      if (inApparent.has(sigma)) continue;
      const partner = partners.get(`${sigma.vertices}`);
      if (partner === undefined || partner.vertices.length !== d + 2) continue; // essential or negative
      const cofaces = bySize[d + 2].filter((t) => isFace(sigma.vertices, t.vertices));
      const earliest = cofaces.reduce((a, b) => (before(b, a) ? b : a));
      if (earliest === partner && partner.f === sigma.f) count++;
    }
    counts.set(d, count);
  }
  return counts;
}

/** G(n, density) with integer weights in 1..levels (seeded): its weight matrix and its edge list. */
function sampleGraph(seed: number, n = 11, density = 0.75, levels = 4) {
  const random = seededRandom(seed);
  const w: number[][] = Array.from({ length: n }, () => new Array<number>(n).fill(Infinity));
  const edges = {
    n,
    directed: false,
    sources: [] as number[],
    targets: [] as number[],
    weights: [] as number[],
  };
  for (let u = 0; u < n; u++) {
    for (let v = u + 1; v < n; v++) {
      if (random() >= density) continue;
      const weight = 1 + Math.floor(random() * levels);
      w[u][v] = weight;
      w[v][u] = weight;
      edges.sources.push(u);
      edges.targets.push(v);
      edges.weights.push(weight);
    }
  }
  return { n, w, edges };
}

/**
 * A lower bound on the column additions of dimension d. In a matrix reduction a column's pivot changes
 * only when another column is added to it (the reduction algorithm of the textbook Computational Topology:
 * An Introduction, AMS, 2010, §VII.1). Reduced as coboundaries (the persistence pairs are the same:
 * "Dualities in persistent (co)homology", Inverse Problems 27, 2011), the column of a positive d-simplex σ starts with its earliest coface as pivot and ends with σ's
 * partner as pivot, or empty when σ never dies. So every positive σ that has a coface and whose partner is
 * not its earliest coface costs at least one addition; negative simplices' columns are cleared.
 */
function additionLowerBound(bySize: Simplex[][], n: number, d: number): number {
  const partners = persistencePartners(bySize, n);
  let count = 0;
  for (const sigma of bySize[d + 1]) {
    const partner = partners.get(`${sigma.vertices}`);
    if (partner !== undefined && partner.vertices.length === d) continue; // negative: kills a (d-1)-class
    const cofaces = bySize[d + 2].filter((t) => isFace(sigma.vertices, t.vertices));
    if (cofaces.length === 0) continue;
    const earliest = cofaces.reduce((a, b) => (before(b, a) ? b : a));
    if (partner !== earliest) count++;
  }
  return count;
}

describe("apparent and emergent pairs against their definitions, by brute force", () => {
  for (const seed of [701, 702, 703, 704]) {
    it(`G(11, 0.75) with weights in 1..4, seed ${seed}: counters and zero-length bars, both layouts`, () => {
      const { n, w, edges } = sampleGraph(seed);
      const maxDim = 2;
      const bySize = cliques(n, w, maxDim + 2);
      const expected = apparentPairs(bySize, maxDim);
      const emergent = emergentPairs(bySize, n, maxDim, expected);
      let total = 0;
      for (const cliqueLayout of ["dense", "sparse"] as const) {
        const barcode = computeBarcode(fromEdgeList(edges), {
          semantics: "distance",
          maxDim,
          keepZeroLength: true,
          cliqueLayout,
        });
        for (let d = 1; d <= maxDim; d++) {
          const pairs = expected.get(d) ?? [];
          expect(barcode.stats.apparentPairs[d], `apparent pairs of dimension ${d}, ${cliqueLayout}`).toBe(
            pairs.length,
          );
          expect(barcode.stats.emergentPairs[d], `emergent pairs of dimension ${d}, ${cliqueLayout}`).toBe(
            emergent.get(d),
          );
          // Each apparent pair is a zero-length bar from σ to τ.
          const bars = new Set(
            barcode.bars
              .filter((b) => b.dim === d && b.birth === b.death)
              .map((b) => `${b.birthSimplex} ${b.deathSimplex}`),
          );
          for (const [sigma, tau] of pairs) expect(bars).toContain(`${sigma.vertices} ${tau.vertices}`);
          total += pairs.length;
        }
      }
      // The sample has apparent pairs in both dimensions to find.
      expect(expected.get(1)?.length).toBeGreaterThan(0);
      expect(expected.get(2)?.length).toBeGreaterThan(0);
      expect(total).toBeGreaterThan(0);
      expect(emergent.get(2)).toBeGreaterThan(0);
    });
  }
});

describe("column additions against a lower bound from the reduction's definition", () => {
  // With few weight levels many pivots move by the apparent-pair shortcut; with distinct weights (1..1000)
  // most move by adding a finished column.
  const samples = [
    ...[701, 702, 703, 704].map((seed) => ({ seed, n: 11, density: 0.75, levels: 4 })),
    ...[1, 2, 3].map((seed) => ({ seed, n: 14, density: 0.7, levels: 1000 })),
  ];
  for (const { seed, n, density, levels } of samples) {
    it(`G(${n}, ${density}) with weights in 1..${levels}, seed ${seed}: at least one addition per column whose pivot moves`, () => {
      const { w, edges } = sampleGraph(seed, n, density, levels);
      const maxDim = 2;
      const bySize = cliques(n, w, maxDim + 2);
      const bounds = [1, 2].map((d) => additionLowerBound(bySize, n, d));
      // The sample has such columns in both dimensions, so the bound is not vacuous.
      expect(bounds[0]).toBeGreaterThan(0);
      expect(bounds[1]).toBeGreaterThan(0);
      for (const cliqueLayout of ["dense", "sparse"] as const) {
        const barcode = computeBarcode(fromEdgeList(edges), {
          semantics: "distance",
          maxDim,
          prime: 2,
          cliqueLayout,
        });
        for (const d of [1, 2]) {
          expect(
            barcode.stats.columnAdditions[d],
            `additions of dimension ${d}, ${cliqueLayout}`,
          ).toBeGreaterThanOrEqual(bounds[d - 1]);
        }
      }
    });
  }
});

import { describe, expect, it } from "vitest";
import { binomial } from "../../../../test/support/combinatorics.js";
import { randomArcs } from "../../../../test/support/random-arcs.js";
import { fromEdgeList } from "../graph/from-edge-list.js";
import { computeBarcode } from "./compute-barcode.js";

/**
 * The work counters of `Barcode.stats` (printed by the benchmark and the CLI) against a plain reduction
 * written here: the coboundary matrix of the clique complex of a small complete graph, built from vertex
 * sets, reduced column by column over Z/p from the last simplex of the filtration to the first, each
 * pivot (lowest entry) cancelled by adding the earlier column that owns it, with clearing (a simplex that
 * killed a class one dimension lower is skipped). Persistent cohomology as in "Dualities in persistent
 * (co)homology" (Inverse Problems 27, 2011), clearing as in "Persistent homology computation with a twist"
 * (EuroCG 2011). No shortcut of the project's reduction is copied: apparent and emergent pairs are plain
 * columns here, reduced like any other.
 *
 * Why the counters must agree with it: the project's shortcuts pair a column without touching the matrix
 * only when the plain reduction would pair it with no addition (an apparent or emergent pair is its own
 * column's pivot, owned by nobody yet), and every addition the project makes is the plain one (the pivot's
 * owner, or the column of the apparent pair whose coface is the pivot, which that pair owns in the plain
 * reduction). So the additions are the same, one by one, and so is each column's chain (the simplices
 * whose coboundaries sum to it: the plain reduction's V column).
 */

/** Filtration order (f, then the combinatorial number system index of the ascending vertex set). */
interface Simplex {
  vertices: number[];
  f: number;
  key: number;
}

function keyOf(vertices: readonly number[]): number {
  let key = 0;
  for (let i = 0; i < vertices.length; i++) key += binomial(vertices[i], i + 1);
  return key;
}

/** Every simplex of dimension `dim` of the clique complex of the complete graph with edge values `w`. */
function simplices(n: number, dim: number, w: (u: number, v: number) => number): Simplex[] {
  const out: Simplex[] = [];
  const chosen: number[] = [];
  const extend = (from: number): void => {
    if (chosen.length === dim + 1) {
      let f = 0; // distances: vertices enter at 0
      for (let a = 0; a < chosen.length; a++)
        for (let b = a + 1; b < chosen.length; b++) f = Math.max(f, w(chosen[a], chosen[b]));
      out.push({ vertices: [...chosen], f, key: keyOf(chosen) });
      return;
    }
    for (let v = from; v < n; v++) {
      chosen.push(v);
      extend(v + 1);
      chosen.pop();
    }
  };
  extend(0);
  return out;
}

/** A column over Z/p: coface key → non-zero coefficient. */
type Column = Map<number, number>;

function addScaled(into: Column, from: Column, factor: number, p: number): void {
  for (const [key, coef] of from) {
    const sum = ((into.get(key) ?? 0) + factor * coef) % p;
    if (sum === 0) into.delete(key);
    else into.set(key, sum);
  }
}

interface PlainReduction {
  /** Column additions made in this dimension. */
  additions: number;
  /** Size of each chain (V column) of the columns that found a pivot. */
  chainSizes: number[];
  /** Keys of the cofaces that became pivots: the next dimension clears them. */
  pivots: Set<number>;
}

/** The plain cohomology reduction of the dim-simplices of the clique complex, over Z/p. */
function plainReduction(
  n: number,
  dim: number,
  w: (u: number, v: number) => number,
  p: number,
  cleared: ReadonlySet<number>,
): PlainReduction {
  const cofaces = new Map<number, Simplex>();
  for (const s of simplices(n, dim + 1, w)) cofaces.set(s.key, s);
  const earlier = (a: number, b: number): boolean => {
    const sa = cofaces.get(a) as Simplex;
    const sb = cofaces.get(b) as Simplex;
    return sa.f !== sb.f ? sa.f < sb.f : sa.key < sb.key;
  };
  const columns = simplices(n, dim, w).sort((a, b) => (a.f !== b.f ? b.f - a.f : b.key - a.key));
  const owners = new Map<number, { r: Column; v: Column }>();
  const result: PlainReduction = { additions: 0, chainSizes: [], pivots: new Set() };
  for (const sigma of columns) {
    if (cleared.has(sigma.key)) continue;
    // δσ: the coface σ ∪ {x} with coefficient (−1)^(position of x in it).
    const r: Column = new Map();
    for (let x = 0; x < n; x++) {
      if (sigma.vertices.includes(x)) continue;
      const tau = [...sigma.vertices, x].sort((a, b) => a - b);
      r.set(keyOf(tau), tau.indexOf(x) % 2 === 0 ? 1 : p - 1);
    }
    const v: Column = new Map([[sigma.key, 1]]);
    for (;;) {
      if (r.size === 0) break; // essential class
      let pivot = -1;
      for (const key of r.keys()) if (pivot < 0 || earlier(key, pivot)) pivot = key;
      const owner = owners.get(pivot);
      if (owner === undefined) {
        owners.set(pivot, { r, v });
        result.pivots.add(pivot);
        result.chainSizes.push(v.size);
        break;
      }
      // −(c / c_owner) times the owner's column; p is prime, so c_owner^(p−2) is its inverse.
      const c = r.get(pivot) as number;
      let inverse = 1;
      for (let i = 0; i < p - 2; i++) inverse = (inverse * (owner.r.get(pivot) as number)) % p;
      const factor = ((p - c) * inverse) % p;
      addScaled(r, owner.r, factor, p);
      addScaled(v, owner.v, factor, p);
      result.additions++;
    }
  }
  return result;
}

/** The plain reductions of dimensions 0 … maxDim, each cleared by the pivots of the one below. */
function plainReductions(n: number, maxDim: number, w: (u: number, v: number) => number, p: number) {
  const out: PlainReduction[] = [];
  let cleared: ReadonlySet<number> = new Set();
  for (let dim = 0; dim <= maxDim; dim++) {
    const reduction = plainReduction(n, dim, w, p, cleared);
    out.push(reduction);
    cleared = reduction.pivots;
  }
  return out;
}

/** Complete graphs of n vertices with distances 1 … levels (test/support/random-arcs.ts). */
function completeCase(n: number, levels: number, seed: number) {
  const arcs = randomArcs(n, 1, levels, seed, false);
  const value = new Map<number, number>();
  for (let e = 0; e < arcs.sources.length; e++)
    value.set(arcs.sources[e] * n + arcs.targets[e], arcs.weights[e]);
  const w = (u: number, v: number): number => value.get(Math.min(u, v) * n + Math.max(u, v)) as number;
  return { graph: fromEdgeList(arcs), w };
}

/**
 * Chains at least this long keep their reduced entries: STORE_ENTRIES_FROM_CHAIN in cohomology-reduction.ts,
 * the rule `storedColumns` counts by (with room to store, as here: the entries of these complexes take a few
 * kilobytes of the default 2 GiB budget).
 */
const STORED_FROM_CHAIN = 4;

describe("the reduction's work counters against a plain reduction", () => {
  it("columnAdditions and storedColumns are those of the plain reduction, dimension by dimension", () => {
    // Complete graphs of 10–16 vertices, distances with ties (2–6 levels) and without (1–1000), Z/2, Z/3,
    // Z/5; dimensions 1 and 2 (cofaces up to tetrahedra).
    const cases = [
      [10, 3, 2, 3],
      [11, 5, 4, 5],
      [14, 2, 8, 2],
      [16, 6, 9, 3],
      [16, 1000, 7, 2],
    ];
    const chainSizes = new Set<number>();
    let additions = 0;
    for (const [n, levels, seed, p] of cases) {
      const { graph, w } = completeCase(n, levels, seed);
      const maxDim = 2;
      const barcode = computeBarcode(graph, { semantics: "distance", maxDim, prime: p });
      const plain = plainReductions(n, maxDim, w, p);
      for (let dim = 1; dim <= maxDim; dim++) {
        const where = `K_${n}, distances 1–${levels}, seed ${seed}, Z/${p}, dimension ${dim}`;
        expect(barcode.stats.columnAdditions[dim], `additions, ${where}`).toBe(plain[dim].additions);
        const long = plain[dim].chainSizes.filter((size) => size >= STORED_FROM_CHAIN).length;
        expect(barcode.stats.storedColumns[dim], `stored columns, ${where}`).toBe(long);
        for (const size of plain[dim].chainSizes) chainSizes.add(size);
        additions += plain[dim].additions;
      }
    }
    // The cases reach both sides of the rule: chains of one simplex (no addition), of three, and of
    // exactly four; and additions of columns that kept their entries.
    expect([1, 3, 4].every((size) => chainSizes.has(size))).toBe(true);
    expect(additions).toBeGreaterThan(100);
  });
});

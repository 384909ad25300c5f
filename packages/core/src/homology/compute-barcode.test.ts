import { describe, expect, it, vi } from "vitest";
import { sweepPolicies } from "../../../../test/support/band-sweep-policies.js";
import { explicitGrid } from "../filtration/threshold-grid.js";
import { fromEdgeList } from "../graph/from-edge-list.js";
import { bettiAt } from "./betti-at.js";
import { bettiCurves, bettiFromBarcode } from "./betti-curves.js";
import { CliqueCoboundaries } from "./clique-coboundaries.js";
import { computeBarcode } from "./compute-barcode.js";
import { ByteLedger, HomologyBudgetError } from "./homology-budget.js";

function graph(n: number, edges: [number, number, number][], directed = false) {
  return fromEdgeList({
    n,
    sources: edges.map((e) => e[0]),
    targets: edges.map((e) => e[1]),
    weights: edges.map((e) => e[2]),
    directed,
  });
}

describe("computeBarcode", () => {
  // A square 0-1-2-3 whose diagonal 0-2 enters last: one loop born with the 4th side, killed by the diagonal
  // (hand-computed; common practice).
  const square = graph(4, [
    [0, 1, 1],
    [1, 2, 2],
    [2, 3, 3],
    [3, 0, 4],
    [0, 2, 5],
  ]);

  it("finds the loop of a square and its death by the diagonal (distance weights)", () => {
    const barcode = computeBarcode(square, { semantics: "distance", maxDim: 1 });
    const h1 = barcode.bars.filter((b) => b.dim === 1);
    expect(h1).toEqual([{ dim: 1, birth: 4, death: 5, birthSimplex: [0, 3], deathSimplex: [0, 2, 3] }]);
    const h0 = barcode.bars.filter((b) => b.dim === 0);
    expect(h0.map((b) => b.death)).toEqual([1, 2, 3, null]);
    expect(h0.every((b) => b.birth === 0)).toBe(true);
  });

  it("reports similarity bars in the user's units, thresholds going down", () => {
    const barcode = computeBarcode(square, { semantics: "similarity", maxDim: 1 });
    // Similarity: vertices are born at 5 with the edge 0-2 (a zero-length death, dropped), then 3-0 (4)
    // merges, 2-3 (3) closes the triangle {0,2,3} at once, 1-2 (2) merges, 0-1 (1) closes {0,1,2} at once.
    expect(barcode.bars.filter((b) => b.dim === 1)).toEqual([]);
    expect(barcode.bars.filter((b) => b.dim === 0).map((b) => b.death)).toEqual([4, 2, null]);
    expect(barcode.start).toBe(5);
  });

  it("reads a threshold before the filtration start as n isolated vertices, as the counts do", () => {
    // Similarity weights start at 5; at 6 no edge is in: four components, no loop (χ = 4 = β0).
    const barcode = computeBarcode(square, { semantics: "similarity", maxDim: 1 });
    expect(bettiFromBarcode(barcode, 6)).toEqual([4, 0]);
    const curves = bettiCurves(barcode, explicitGrid([6, 5, 4.5], "similarity")).map((row) =>
      Array.from(row),
    );
    // At 5 the diagonal 0-2 is in: three components; at 4.5 still three.
    expect(curves).toEqual([
      [4, 0],
      [3, 0],
      [3, 0],
    ]);
  });

  it("keeps zero-length bars only when asked", () => {
    const tied = graph(3, [
      [0, 1, 1],
      [1, 2, 1],
      [0, 2, 1],
    ]);
    // Ties go by the combinatorial order: edges by larger end, then smaller, so {1,2} enters last and is
    // the one that creates the (instantly filled) loop.
    const plain = computeBarcode(tied, { semantics: "distance", maxDim: 1 });
    const kept = computeBarcode(tied, { semantics: "distance", maxDim: 1, keepZeroLength: true });
    expect(plain.bars.filter((b) => b.dim === 1)).toEqual([]);
    expect(kept.bars.filter((b) => b.dim === 1)).toEqual([
      { dim: 1, birth: 1, death: 1, birthSimplex: [1, 2], deathSimplex: [0, 1, 2] },
    ]);
  });

  it("agrees with direct ranks at every threshold on a directed graph with reciprocal arcs", () => {
    const g = graph(
      4,
      [
        [0, 1, 1],
        [1, 0, 2],
        [1, 2, 2],
        [2, 0, 3],
        [0, 2, 4],
        [2, 3, 4],
        [3, 1, 5],
        [1, 3, 6],
      ],
      true,
    );
    for (const prime of [2, 3]) {
      const barcode = computeBarcode(g, { semantics: "distance", maxDim: 2, prime });
      for (const t of [0, 1, 2, 3, 4, 5, 6]) {
        expect(bettiFromBarcode(barcode, t)).toEqual(
          bettiAt(g, { threshold: t, semantics: "distance", maxDim: 2, prime }),
        );
      }
    }
  });

  it("stops with a budget error on a tiny budget", () => {
    const edges: [number, number, number][] = [];
    for (let u = 0; u < 30; u++) for (let v = u + 1; v < 30; v++) edges.push([u, v, u * 31 + v]);
    expect(() =>
      computeBarcode(graph(30, edges), { semantics: "distance", maxDim: 2, budget: { maxBytes: 20_000 } }),
    ).toThrow(HomologyBudgetError);
  });
});

describe("computeBarcode under a tight budget", () => {
  it("gives the same bars with a budget just above the peak (columns keep only their chains)", () => {
    const edges: [number, number, number][] = [];
    let x = 17;
    for (let u = 0; u < 26; u++) {
      for (let v = u + 1; v < 26; v++) {
        x = (x * 48271) % 2147483647;
        edges.push([u, v, x / 2147483647]);
      }
    }
    const g = graph(26, edges);
    const roomy = computeBarcode(g, { semantics: "similarity", maxDim: 2 });
    const tight = computeBarcode(g, {
      semantics: "similarity",
      maxDim: 2,
      budget: { maxBytes: Math.ceil(roomy.stats.peakBytes * 1.1) },
    });
    expect(tight.bars).toEqual(roomy.bars);
    // Implicit reduction stores the same chains whatever the budget.
    expect(tight.stats.peakBytes).toBe(roomy.stats.peakBytes);
  });
});

describe("stored reduced entries under a tight memory budget", () => {
  // Complete graph on 40 vertices with seeded integer distances 1–1000 (a small linear congruential
  // generator, so the test needs no fixture). The reference is the same barcode with the default budget,
  // which the rank tests (barcode-matches-ranks.test.ts) check on graphs of this kind.
  const n = 40;
  let state = 12345;
  const next = () => {
    state = (Math.imul(state, 1103515245) + 12345) >>> 0;
    return state / 2 ** 32;
  };
  const sources: number[] = [];
  const targets: number[] = [];
  const weights: number[] = [];
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      sources.push(i);
      targets.push(j);
      weights.push(1 + Math.floor(next() * 1000));
    }
  }
  const g = fromEdgeList({ n, sources, targets, weights, directed: false });

  it("gives the same bars under any budget it finishes in, and its own error below that", () => {
    // Stored entries take little room at this size (16 per column at first, the rest as read), so the
    // budget stops the run before their quarter share binds; columns without room for entries are
    // checked in stored-entries-without-room.test.ts. The same with the sweep over bands forced.
    for (const bandSweep of ["off" as const, sweepPolicies.earlyHandOff, sweepPolicies.wholeFiltration]) {
      const reference = computeBarcode(g, { semantics: "distance", maxDim: 2, bandSweep });
      if (bandSweep === "off") expect(reference.stats.storedColumns[2]).toBeGreaterThan(0);
      else expect(reference.stats.sweptColumns[2]).toBeGreaterThan(0);
      let finished = 0;
      let stopped = 0;
      for (const share of [1.5, 1.3, 1.1, 1, 0.95, 0.9, 0.85, 0.8, 0.7]) {
        const maxBytes = Math.round(reference.stats.peakBytes * share);
        try {
          const tight = computeBarcode(g, {
            semantics: "distance",
            maxDim: 2,
            bandSweep,
            budget: { maxBytes },
          });
          expect(tight.bars).toEqual(reference.bars);
          expect(tight.stats.peakBytes).toBeLessThanOrEqual(maxBytes);
          finished++;
        } catch (error) {
          expect(error).toBeInstanceOf(HomologyBudgetError);
          stopped++;
        }
      }
      expect(finished).toBeGreaterThan(0);
      expect(stopped).toBeGreaterThan(0);
    }
  });
});

describe("the simplex lists in the ledger", () => {
  it("gives each dimension's list back as soon as no later dimension needs it (K_10 to H4)", () => {
    // The clique model builds the list of dimension d + 1 from the list of dimension d (CliqueCoboundaries
    // .listSimplices), and the reduction of d + 1 reads only its own list: once d + 1 is listed, the list of
    // d − 1 is needed by no later dimension (CoboundaryModel.releaseSimplices: its memory goes back to the
    // budget). So when a list is built the ledger may hold the one it is built from and no other. Lists
    // are seen where they are charged (the stage "listing the d-simplices") and given back
    // (releaseSimplices of a list held).
    const edges: [number, number, number][] = [];
    for (let u = 0; u < 10; u++)
      for (let v = u + 1; v < 10; v++) edges.push([u, v, 1 + ((u * 7 + v * 13) % 41)]);
    const held = new Set<number>();
    const heldWhenBuilt: number[][] = [];
    const reserve = ByteLedger.prototype.reserve;
    const reserveSpy = vi.spyOn(ByteLedger.prototype, "reserve").mockImplementation(function (
      this: ByteLedger,
      bytes: number,
      stage: string,
    ) {
      const listing = /^listing the (\d+)-simplices$/.exec(stage);
      if (listing !== null && !held.has(Number(listing[1]))) {
        heldWhenBuilt.push([Number(listing[1]), ...[...held].sort((a, b) => a - b)]);
        held.add(Number(listing[1]));
      }
      reserve.call(this, bytes, stage);
    });
    const release = CliqueCoboundaries.prototype.releaseSimplices;
    const releaseSpy = vi
      .spyOn(CliqueCoboundaries.prototype, "releaseSimplices")
      .mockImplementation(function (this: CliqueCoboundaries, dim: number) {
        held.delete(dim);
        release.call(this, dim);
      });
    try {
      const barcode = computeBarcode(graph(10, edges), { semantics: "distance", maxDim: 4 });
      expect(barcode.stats.simplices).toEqual([10, 45, 120, 210, 252]);
    } finally {
      reserveSpy.mockRestore();
      releaseSpy.mockRestore();
    }
    // [list built, lists held then]: the edges (for union–find, then dimension 1), each higher list next to
    // the one below only.
    expect(heldWhenBuilt).toEqual([[1], [2, 1], [3, 2], [4, 3]]);
  });
});

describe("computeBarcode options and order", () => {
  const triangle = graph(3, [
    [0, 1, 1],
    [1, 2, 2],
    [0, 2, 3],
  ]);

  it("refuses a maxDim that is negative or not an integer, and accepts 0", () => {
    for (const maxDim of [-1, 1.5, Number.NaN]) {
      expect(() => computeBarcode(triangle, { semantics: "distance", maxDim })).toThrow(RangeError);
      expect(() => computeBarcode(triangle, { semantics: "distance", maxDim })).toThrow(
        `maxDim must be a non-negative integer, got ${maxDim}`,
      );
    }
    const h0 = computeBarcode(triangle, { semantics: "distance", maxDim: 0 });
    expect(h0.bars.map((b) => [b.dim, b.birth, b.death])).toEqual([
      [0, 0, 1],
      [0, 0, 2],
      [0, 0, null],
    ]);
    expect(h0.keepZeroLength).toBe(false);
    expect(h0.prime).toBe(2);
  });

  // Three squares 0-1-2-3, 4-5-6-7, 8-9-10-11 with sides at 1 and one diagonal each at 2 (distance): three
  // loops born and killed at the same values, so only the birth simplices order them. Worked by hand: edges
  // enter by (value, larger end, smaller end), so the loop of each square is closed by its last side
  // {2,3}, {6,7}, {10,11}, and killed by the one triangle on that side and the diagonal. In H0 (the elder
  // rule, H. Edelsbrunner and J. Harer, Computational Topology, 2010, §VII.1: the younger component dies,
  // here the one whose oldest vertex is larger) the vertices 1, 2, 3 of the first square die with the
  // first three sides, and so on; 0, 4 and 8 live for ever.
  const squares: [number, number, number][] = [];
  for (const base of [8, 4, 0]) {
    squares.push([base, base + 1, 1], [base + 1, base + 2, 1], [base + 2, base + 3, 1], [base + 3, base, 1]);
    squares.push([base, base + 2, 2]);
  }
  const threeSquares = graph(12, squares);

  it("sorts bars by dimension, birth, death, then birth simplex", () => {
    const barcode = computeBarcode(threeSquares, { semantics: "distance", maxDim: 1 });
    expect(barcode.bars.filter((b) => b.dim === 1)).toEqual([
      { dim: 1, birth: 1, death: 2, birthSimplex: [2, 3], deathSimplex: [0, 2, 3] },
      { dim: 1, birth: 1, death: 2, birthSimplex: [6, 7], deathSimplex: [4, 6, 7] },
      { dim: 1, birth: 1, death: 2, birthSimplex: [10, 11], deathSimplex: [8, 10, 11] },
    ]);
    const h0 = barcode.bars.filter((b) => b.dim === 0);
    expect(h0.map((b) => [b.birthSimplex[0], b.death])).toEqual([
      [1, 1],
      [2, 1],
      [3, 1],
      [5, 1],
      [6, 1],
      [7, 1],
      [9, 1],
      [10, 1],
      [11, 1],
      [0, null],
      [4, null],
      [8, null],
    ]);
    expect(barcode.bars.slice(0, 12)).toEqual(h0);
  });

  it("orders tied bars whose birth simplices share their first vertex by the next one", () => {
    // Two squares 2-5-0-3 and 2-6-1-4 that share only vertex 2, sides at 1, diagonals {0,2} and {1,2} at 2:
    // two loops born at 1 and killed at 2, closed by the sides {2,5} and {2,6} (each square's last side in
    // the combinatorial order), so only the second vertex orders them. Worked by hand.
    const shared = graph(7, [
      [2, 5, 1],
      [0, 5, 1],
      [0, 3, 1],
      [2, 3, 1],
      [2, 6, 1],
      [1, 6, 1],
      [1, 4, 1],
      [2, 4, 1],
      [0, 2, 2],
      [1, 2, 2],
    ]);
    const barcode = computeBarcode(shared, { semantics: "distance", maxDim: 1 });
    expect(barcode.bars.filter((b) => b.dim === 1)).toEqual([
      { dim: 1, birth: 1, death: 2, birthSimplex: [2, 5], deathSimplex: [0, 2, 5] },
      { dim: 1, birth: 1, death: 2, birthSimplex: [2, 6], deathSimplex: [1, 2, 6] },
    ]);
  });

  it("picks the dense edge-value matrix only for graphs with ≥ 5 % of all edges, within an eighth of the budget", () => {
    // The documented rule of chooseLayout; both layouts give the same bars.
    const cycle = (n: number, extra: number): [number, number, number][] => {
      const edges: [number, number, number][] = [];
      for (let v = 0; v < n; v++) edges.push([v, (v + 1) % n, v + 1]);
      for (let k = 0; k < extra; k++) edges.push([0, 2 + k, n + 1 + k]);
      return edges;
    };
    // 41 vertices: 41 of the 820 pairs are edges of the cycle, exactly 5 %; 40 edges of a path are fewer.
    const atFivePercent = graph(41, cycle(41, 0));
    const path = graph(41, cycle(41, 0).slice(0, 40));
    const representation = (g: ReturnType<typeof graph>, maxBytes?: number) =>
      computeBarcode(g, { semantics: "distance", maxDim: 1, budget: maxBytes ? { maxBytes } : undefined })
        .stats.representation;
    expect(representation(atFivePercent)).toBe("clique-dense");
    expect(representation(path)).toBe("clique-sparse");
    // 80 vertices, a cycle and the chords {v, v+2}: 160 of 3,160 pairs. The 80 × 80 matrix of doubles takes
    // 51,200 bytes: dense from a budget of 8 × 51,200 bytes on.
    const chorded = graph(
      80,
      cycle(80, 0).concat(
        Array.from({ length: 80 }, (_, v) => [v, (v + 2) % 80, 100 + v] as [number, number, number]),
      ),
    );
    expect(representation(chorded, 8 * 80 * 80 * 8)).toBe("clique-dense");
    expect(representation(chorded, 8 * 80 * 80 * 8 - 1)).toBe("clique-sparse");
    // An explicit choice is kept, whatever the rule says.
    expect(
      computeBarcode(path, { semantics: "distance", maxDim: 1, cliqueLayout: "dense" }).stats.representation,
    ).toBe("clique-dense");
    const dense = computeBarcode(atFivePercent, { semantics: "distance", maxDim: 1, cliqueLayout: "dense" });
    const sparse = computeBarcode(atFivePercent, {
      semantics: "distance",
      maxDim: 1,
      cliqueLayout: "sparse",
    });
    expect(sparse.stats.representation).toBe("clique-sparse");
    expect(sparse.bars).toEqual(dense.bars);
    // The cycle's one loop, born with its last edge (value 41), never filled.
    expect(dense.bars.filter((b) => b.dim === 1).map((b) => [b.birth, b.death])).toEqual([[41, null]]);
  });
});

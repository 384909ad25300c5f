import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { sweepPolicies } from "../../../../test/support/band-sweep-policies.js";
import { seededRandom } from "../../../../test/support/random.js";
import { fromEdgeList } from "../graph/from-edge-list.js";
import type { WeightedGraph } from "../graph/weighted-graph.js";
import { bettiAt } from "./betti-at.js";
import { bettiFromBarcode } from "./betti-curves.js";
import { computeBarcode } from "./compute-barcode.js";

/**
 * Property: Betti numbers read off the barcode equal those computed directly by ranks of boundary matrices
 * at every threshold where anything changes, for both clique layouts and for directed graphs with
 * reciprocal arcs, with few distinct weights so that ties are frequent.
 */
const arbitraryGraph = (directed: boolean) =>
  fc
    .record({
      n: fc.integer({ min: 1, max: 8 }),
      density: fc.double({ min: 0.2, max: 1, noNaN: true }),
      levels: fc.integer({ min: 1, max: 5 }),
      seed: fc.integer({ min: 0, max: 2 ** 30 }),
    })
    .map(({ n, density, levels, seed }) => randomGraph(n, density, levels, seed, directed));

function randomGraph(
  n: number,
  density: number,
  levels: number,
  seed: number,
  directed: boolean,
): WeightedGraph {
  let state = seed >>> 0 || 1;
  const next = () => {
    state ^= state << 13;
    state ^= state >>> 17;
    state ^= state << 5;
    return (state >>> 0) / 4294967296;
  };
  const sources: number[] = [];
  const targets: number[] = [];
  const weights: number[] = [];
  for (let u = 0; u < n; u++) {
    for (let v = directed ? 0 : u + 1; v < n; v++) {
      if (u === v || next() > density) continue;
      sources.push(u);
      targets.push(v);
      weights.push(1 + Math.floor(next() * levels));
    }
  }
  return fromEdgeList({ n, sources, targets, weights, directed });
}

function checkAllThresholds(
  graph: WeightedGraph,
  semantics: "distance" | "similarity",
  maxDim: number,
  prime: number,
) {
  const thresholds = [...new Set([...graph.weights, 0])];
  const layouts = graph.directed ? (["auto"] as const) : (["dense", "sparse"] as const);
  // Over Z/2 also with the sweep over bands forced, each way it can end.
  const sweeps = prime === 2 ? ["off" as const, ...Object.values(sweepPolicies)] : ["off" as const];
  for (const cliqueLayout of layouts) {
    for (const bandSweep of sweeps) {
      const barcode = computeBarcode(graph, { semantics, maxDim, prime, cliqueLayout, bandSweep });
      for (const threshold of thresholds) {
        const direct = bettiAt(graph, { threshold, semantics, maxDim, prime });
        expect(bettiFromBarcode(barcode, threshold)).toEqual(direct);
      }
    }
  }
}

describe("barcode against direct ranks", () => {
  it("undirected clique complexes, Z/2 and Z/3, both weight semantics", () => {
    fc.assert(
      fc.property(
        arbitraryGraph(false),
        fc.constantFrom(2, 3),
        fc.constantFrom("distance" as const, "similarity" as const),
        (g, p, s) => checkAllThresholds(g, s, 3, p),
      ),
      { numRuns: 150 },
    );
  });

  it("directed flag complexes with reciprocal arcs, Z/2 and Z/5", () => {
    fc.assert(
      fc.property(
        arbitraryGraph(true),
        fc.constantFrom(2, 5),
        fc.constantFrom("distance" as const, "similarity" as const),
        (g, p, s) => checkAllThresholds(g, s, 2, p),
      ),
      { numRuns: 150 },
    );
  });
});

describe("barcode against direct ranks on larger complete graphs", () => {
  // Complete graphs of 18–36 vertices with random weights make long reductions: stored columns are
  // regenerated from their chains many times over, the lazy column widens its horizon repeatedly, and from
  // 24 vertices on some finished columns keep their sorted reduced entries (stats.storedColumns), read by
  // cursors and continued from their chains past the stored cover.
  for (const [n, seed, prime] of [
    [18, 3, 2],
    [20, 4, 2],
    [22, 5, 3],
    [24, 6, 2],
    [30, 7, 3],
    [36, 8, 2],
  ]) {
    it(`n=${n}, seed ${seed}, Z/${prime}`, () => {
      const g = randomGraph(n, 1, 1000, seed, false);
      const sorted = [...new Set(g.weights)].sort((a, b) => a - b);
      const thresholds = sorted.filter((_, i) => i % Math.ceil(sorted.length / 12) === 0);
      // The implicit reduction (the sweep over bands is compared with it below).
      const implicit = { semantics: "distance", maxDim: 2, prime, bandSweep: "off" } as const;
      const dense = computeBarcode(g, { ...implicit, cliqueLayout: "dense" });
      const sparse = computeBarcode(g, { ...implicit, cliqueLayout: "sparse" });
      expect(sparse.bars).toEqual(dense.bars);
      if (prime === 2) {
        for (const policy of Object.values(sweepPolicies)) {
          const swept = computeBarcode(g, { semantics: "distance", maxDim: 2, prime, bandSweep: policy });
          expect(swept.bars).toEqual(dense.bars);
          // The sweep makes the additions of the same reduction, whichever columns it settles.
          expect(swept.stats.columnAdditions).toEqual(dense.stats.columnAdditions);
        }
      }
      expect(dense.stats.columnAdditions[2]).toBeGreaterThan(0);
      if (n >= 30) expect(dense.stats.storedColumns[2]).toBeGreaterThan(0);
      for (const threshold of thresholds) {
        expect(bettiFromBarcode(dense, threshold)).toEqual(
          bettiAt(g, { threshold, semantics: "distance", maxDim: 2, prime }),
        );
      }
    });
  }
});

/** G(n, density) with integer weights 1–1000 drawn from a seeded generator: long filtrations with few ties. */
function longFiltrationGraph(n: number, density: number, seed: number): WeightedGraph {
  const random = seededRandom(seed);
  const sources: number[] = [];
  const targets: number[] = [];
  const weights: number[] = [];
  for (let u = 0; u < n; u++) {
    for (let v = u + 1; v < n; v++) {
      if (random() >= density) continue;
      sources.push(u);
      targets.push(v);
      weights.push(1 + Math.floor(random() * 1000));
    }
  }
  return fromEdgeList({ n, sources, targets, weights, directed: false });
}

describe("a long filtration, where columns keep sorted entries and the coface horizon widens", () => {
  // G(26, 0.7) with integer distances 1–1000 (seeded): long enough for dimension-2 columns to keep their
  // reduced entries and be read back while the horizon widens — paths that no other test here reaches and
  // where a mutation run found wrong Betti numbers unnoticed (a stored column replayed before it was read:
  // β2 wrong between 770 and 796). The reference is the direct rank computation, as above.
  it("and with similarity weights, where a widened horizon must replay the stored columns read so far (Z/2)", () => {
    // G(34, 0.8), integer similarities 1–1000 (seeded): a column that had read a stored column to its end
    // must push that column's next band when the horizon widens; skipping it gave wrong β2 between 306 and
    // 442 (found by replaying mutants on random graphs). Four levels of that range, against direct ranks.
    const graph = longFiltrationGraph(34, 0.8, 804);
    const weights = [...graph.weights];
    const barcode = computeBarcode(graph, {
      semantics: "similarity",
      maxDim: 2,
      prime: 2,
      timeLimitMs: 20_000,
    });
    expect(barcode.stats.storedColumns[2]).toBeGreaterThan(0);
    const inRange = [...new Set(weights)].filter((w) => w >= 306 && w <= 442).sort((a, b) => a - b);
    const levels = [0, 1, 2, 3].map((k) => inRange[Math.floor((k * (inRange.length - 1)) / 3)]);
    for (const threshold of levels) {
      expect(bettiFromBarcode(barcode, threshold), `Betti numbers at ${threshold}`).toEqual(
        bettiAt(graph, { threshold, semantics: "similarity", maxDim: 2, prime: 2 }),
      );
    }
  });

  it("Betti numbers at each level between 740 and 820 equal the ranks' (Z/2, Z/3)", () => {
    const graph = longFiltrationGraph(26, 0.7, 800);
    const weights = [...graph.weights];
    const levels = [...new Set(weights)].filter((w) => w >= 740 && w <= 820).sort((a, b) => a - b);
    expect(levels.length).toBeGreaterThan(5);
    for (const prime of [2, 3]) {
      const barcode = computeBarcode(graph, { semantics: "distance", maxDim: 2, prime, timeLimitMs: 20_000 });
      expect(barcode.stats.storedColumns[2]).toBeGreaterThan(0);
      for (const threshold of levels) {
        expect(bettiFromBarcode(barcode, threshold), `Betti numbers at ${threshold} over Z/${prime}`).toEqual(
          bettiAt(graph, { threshold, semantics: "distance", maxDim: 2, prime }),
        );
      }
    }
  });
});

describe("long filtrations found by replaying changes of the reduction on random graphs", () => {
  /**
   * Betti numbers read off the barcode against direct ranks (`bettiAt`; the fundamental lemma of persistent
   * homology: β_k at a level is the number of bars alive there) at `count` levels evenly spread over the
   * distinct weights in [from, to]. The graphs and ranges are where a changed reduction went wrong.
   */
  function checkLevels(
    graph: WeightedGraph,
    semantics: "distance" | "similarity",
    maxDim: number,
    range: [number, number],
    maxBytes?: number,
    prime = 2,
    cliqueLayout: "auto" | "dense" | "sparse" = "auto",
  ) {
    // A hang fails the test, but the bound is generous: a mutation run instruments the reduction and runs it
    // about ten times slower (G(200, 0.2) took over 20 s there, against 1–3 s here).
    const budget = maxBytes === undefined ? undefined : { maxBytes };
    // These graphs were found with the implicit reduction; the sweep over bands is checked on them too.
    const options = {
      semantics,
      maxDim,
      prime,
      cliqueLayout,
      timeLimitMs: 90_000,
      budget,
      bandSweep: "off" as const,
    };
    const barcode = computeBarcode(graph, options);
    if (prime === 2) {
      const swept = computeBarcode(graph, { ...options, bandSweep: sweepPolicies.earlyHandOff });
      expect(swept.bars).toEqual(barcode.bars);
    }
    const inRange = [...new Set(graph.weights)]
      .filter((w) => w >= range[0] && w <= range[1])
      .sort((a, b) => a - b);
    expect(inRange.length).toBeGreaterThanOrEqual(4);
    const levels = [0, 1, 2, 3].map((k) => inRange[Math.floor((k * (inRange.length - 1)) / 3)]);
    for (const threshold of levels) {
      expect(bettiFromBarcode(barcode, threshold), `Betti numbers at ${threshold}`).toEqual(
        bettiAt(graph, { threshold, semantics, maxDim, prime }),
      );
    }
    return barcode;
  }

  it("a column whose first coface window ends exactly at the last value (G(36, 0.85), similarities)", () => {
    // Some dimension-2 column has exactly 64 columns to reduce after it, so its first window of cofaces
    // reaches past the last value: the horizon must then be +∞. Read as "the value after the last" it was
    // undefined, a later widening pushed whole coboundaries again, and β2 was wrong from 1 to 644.
    checkLevels(longFiltrationGraph(36, 0.85, 3), "similarity", 2, [560, 644]);
  });

  it("a column whose widened coface window ends exactly at the last value (G(45, 0.67), similarities)", () => {
    // The same boundary when the window doubles: read as "the value after the last", the horizon was
    // undefined and β2 was wrong between 338 and 382.
    checkLevels(longFiltrationGraph(45, 0.67, 20), "similarity", 2, [338, 382]);
  });

  it("stored columns read past their cover (complete graph of 64 vertices, distances 1–1000)", () => {
    // Past its stored entries a column is extended by the entries of the next values, stored as a segment
    // that continues it; only long filtrations like this one read that far.
    const barcode = checkLevels(randomGraph(64, 1, 1000, 9, false), "distance", 2, [431, 489]);
    expect(barcode.stats.storedColumns[2]).toBeGreaterThan(64);
  });

  it("a stored column read on through its first extension segment (G(33, 0.5), distances, Z/3)", () => {
    // The cursor of a stored column that has read extension segment 0 reads on in the segment after it;
    // taking segment 0 for "no segment read yet" sent it back to the column's first segment, 0 again, and
    // the reduction never ended (found by replaying changes of the reduction on random graphs).
    const graph = longFiltrationGraph(33, 0.5, 45);
    const barcode = checkLevels(graph, "distance", 2, [1, 1000], undefined, 3, "sparse");
    expect(barcode.stats.storedColumns[2]).toBeGreaterThan(0);
  });

  for (const seed of [3, 4]) {
    it(`edges whose columns add more than 64 stored columns (G(200, 0.2), seed ${seed}, distances)`, () => {
      // 200 vertices, dimension 1 only: over 200 edge columns keep their reduced entries, and single columns
      // add more than 64 of them, so the list of stored columns added to one column must grow. Without the
      // growth (or grown to half) β1 went wrong between 610 and 675, as it did when a column without stored
      // entries was read as one, when the values bounding the coface windows were left unsorted (seed 3),
      // or when a widened window was pushed from the lower of a stored column's cover and the old horizon
      // (seed 4).
      const barcode = checkLevels(longFiltrationGraph(200, 0.2, seed), "distance", 1, [610, 635]);
      expect(barcode.stats.storedColumns[1]).toBeGreaterThan(64);
    });
  }
});

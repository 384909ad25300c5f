/**
 * Every simplex either gives birth to a class or kills one (H. Edelsbrunner, D. Letscher, A. Zomorodian,
 * "Topological persistence and simplification", Discrete Comput. Geom. 28, 2002; H. Edelsbrunner and
 * J. Harer, Computational Topology, 2010, §VII.1): with zero-length bars kept, the d-simplices that kill
 * are the deaths of the finite (d−1)-bars, and the others are the births of the d-bars. The reduction sorts
 * each d-simplex's column into exactly one of four kinds (cleared, apparent pair, emergent pair, reduced),
 * and the first kind is the killers (the clearing lemma: C. Chen and M. Kerber, "Persistent homology
 * computation with a twist", EuroCG 2011), so the barcode's work counters obey, for 1 ≤ d ≤ maxDim:
 *
 *   simplices[d] = cleared[d] + apparent[d] + emergent[d] + reduced[d]   (networkx counts the simplices)
 *   cleared[d]   = number of finite bars of dimension d − 1
 *   apparent[d] + emergent[d] + reduced[d] = number of bars of dimension d
 *
 * The graphs are networkx's G(n, p) (networkx.gnp_random_graph, weights rounded to 0.01 so that many
 * simplices tie) and their simplex counts networkx.enumerate_all_cliques (test/support/python/clique_counts.py).
 */

import { type Barcode, computeBarcode, fromEdgeList, type WeightedGraph } from "@cliquescape/core";
import { describe, expect, it } from "vitest";
import { sweepPolicies } from "../support/band-sweep-policies.js";
import { missingPythonModules, runPythonScript } from "../support/python.js";

interface Reference {
  n: number;
  directed: boolean;
  edges: [number, number, number][];
  all: number[];
}

const missing = missingPythonModules(["networkx"]);
const suite = missing ? describe.skip : describe;
const skipNote = missing ? ` (skipped: ${missing})` : "";

function checkPairingLaws(barcode: Barcode, reference: Reference): void {
  const { stats, bars, maxDim } = barcode;
  const barsOf = (d: number) => bars.filter((b) => b.dim === d);
  // Every vertex is born once; networkx's count of 0-simplices is the vertex count.
  expect(stats.simplices[0]).toBe(reference.all[0]);
  expect(barsOf(0).length).toBe(reference.all[0]);
  // Index 0 is union–find's: it reduces no columns, so every column counter starts at 0 there.
  for (const counter of [
    stats.clearedColumns,
    stats.apparentPairs,
    stats.emergentPairs,
    stats.columnsReduced,
    stats.columnAdditions,
    stats.storedColumns,
    stats.sweptColumns,
  ]) {
    expect(counter).toHaveLength(maxDim + 1);
    expect(counter[0]).toBe(0);
  }
  for (let d = 1; d <= maxDim; d++) {
    // Every column is cleared, apparent, emergent, reduced one by one, or settled by the sweep over bands.
    const kinds =
      stats.clearedColumns[d] +
      stats.apparentPairs[d] +
      stats.emergentPairs[d] +
      stats.columnsReduced[d] +
      stats.sweptColumns[d];
    expect(stats.simplices[d], `simplices of dimension ${d}`).toBe(reference.all[d] ?? 0);
    expect(kinds, `columns of dimension ${d} sorted into kinds`).toBe(stats.simplices[d]);
    const killersBelow = barsOf(d - 1).filter((b) => b.death !== null).length;
    expect(stats.clearedColumns[d], `cleared columns of dimension ${d}`).toBe(killersBelow);
    expect(
      stats.apparentPairs[d] + stats.emergentPairs[d] + stats.columnsReduced[d] + stats.sweptColumns[d],
      `bars of dimension ${d}`,
    ).toBe(barsOf(d).length);
    // Additions are counted, never taken away.
    expect(stats.columnAdditions[d]).toBeGreaterThanOrEqual(0);
  }
}

const fetched = new Map<string, { reference: Reference; graph: WeightedGraph }>();

/** networkx's graph and counts, asked once per case. */
function fetchCase(n: number, p: number, seed: number, directed: boolean) {
  const id = `${n} ${p} ${seed} ${directed}`;
  let hit = fetched.get(id);
  if (hit === undefined) {
    const reference = runPythonScript<Reference>("clique_counts.py", { graph: "gnp", n, p, seed, directed });
    const graph = fromEdgeList({
      n: reference.n,
      directed: reference.directed,
      sources: reference.edges.map((e) => e[0]),
      targets: reference.edges.map((e) => e[1]),
      weights: reference.edges.map((e) => e[2]),
    });
    hit = { reference, graph };
    fetched.set(id, hit);
  }
  return hit;
}

suite(`the barcode's column counters follow the birth-or-death law${skipNote}`, () => {
  const cases = [
    { n: 16, p: 0.7, seed: 611, directed: false, maxDim: 2 },
    { n: 12, p: 0.85, seed: 612, directed: false, maxDim: 3 },
    { n: 9, p: 0.55, seed: 613, directed: true, maxDim: 2 },
  ];
  for (const { n, p, seed, directed, maxDim } of cases) {
    it(`${directed ? "directed " : ""}G(${n}, ${p}) seed ${seed}, H0–H${maxDim}, over Z/2 and Z/5`, () => {
      const { reference, graph } = fetchCase(n, p, seed, directed);
      const layouts = directed ? ["auto" as const] : (["dense", "sparse"] as const);
      for (const prime of [2, 5]) {
        // Over Z/2 also with the sweep over bands forced (test/support/band-sweep-policies.ts).
        const sweeps =
          prime === 2
            ? ["auto" as const, sweepPolicies.wholeFiltration, sweepPolicies.earlyHandOff]
            : ["auto" as const];
        for (const cliqueLayout of layouts) {
          for (const bandSweep of sweeps) {
            const kept = computeBarcode(graph, {
              semantics: "distance",
              maxDim,
              prime,
              keepZeroLength: true,
              cliqueLayout,
              bandSweep,
            });
            checkPairingLaws(kept, reference);
            // Dropping zero-length bars changes the bars, not the work.
            const plain = computeBarcode(graph, {
              semantics: "distance",
              maxDim,
              prime,
              cliqueLayout,
              bandSweep,
            });
            expect(plain.stats).toEqual(kept.stats);
            expect(plain.bars).toEqual(kept.bars.filter((b) => b.birth !== b.death));
          }
        }
      }
    });
  }

  it("the samples reach every kind of column", () => {
    // Without this, the laws above could hold trivially (e.g. with no apparent pair at all).
    const seen = { cleared: 0, apparent: 0, emergent: 0, reduced: 0, additions: 0, zeroLength: 0 };
    for (const { n, p, seed, directed, maxDim } of cases) {
      const { graph } = fetchCase(n, p, seed, directed);
      const { stats, bars } = computeBarcode(graph, { semantics: "distance", maxDim, keepZeroLength: true });
      for (let d = 2; d <= maxDim; d++) {
        seen.cleared += stats.clearedColumns[d];
        seen.apparent += stats.apparentPairs[d];
        seen.emergent += stats.emergentPairs[d];
        seen.reduced += stats.columnsReduced[d];
        seen.additions += stats.columnAdditions[d];
      }
      seen.zeroLength += bars.filter((b) => b.dim > 0 && b.birth === b.death).length;
    }
    expect(seen.cleared).toBeGreaterThan(0);
    expect(seen.apparent).toBeGreaterThan(0);
    expect(seen.emergent).toBeGreaterThan(0);
    expect(seen.reduced).toBeGreaterThan(0);
    expect(seen.additions).toBeGreaterThan(0);
    expect(seen.zeroLength).toBeGreaterThan(0);
  });
});

import { describe, expect, it, vi } from "vitest";
import { randomArcs } from "../../../../test/support/random-arcs.js";
import { fromEdgeList } from "../graph/from-edge-list.js";
import type { WorkProgress } from "../work/work-control.js";
import { bettiAt } from "./betti-at.js";
import { bettiFromBarcode } from "./betti-curves.js";
import { computeBarcode } from "./compute-barcode.js";

/**
 * Stored entries take at most a quarter of the memory budget, but on graphs small enough for a test they
 * never come near it (a complete graph of 64 vertices stores about 6,000): here the store's limit is
 * lowered instead, so that columns find no room for their entries and extensions are refused. A column
 * read past its cover then has its chain pushed one band of values at a time behind a marker.
 */
const room = vi.hoisted(() => ({ maxEntries: Number.POSITIVE_INFINITY }));
vi.mock("./reduced-entries.js", async (original) => {
  const module = await original<typeof import("./reduced-entries.js")>();
  class LimitedEntries extends module.ReducedEntries {
    override reserveEntries(count: number): boolean {
      return this.used + count <= room.maxEntries && super.reserveEntries(count);
    }
  }
  return { ...module, ReducedEntries: LimitedEntries };
});

describe("stored entries without room", () => {
  // Complete graphs of 64 vertices, distances 1–1000 (test/support/random-arcs.ts). With room for 4,000
  // entries (seed 3), leaving out the marker after a band let β2 go wrong; with 500 the bands themselves
  // are needed; with none no column keeps entries at all.
  it.each([
    [3, 4000],
    [9, 500],
    [9, 0],
  ])(
    "gives the same bars, and Betti numbers equal to direct ranks (seed %i, room for %i entries)",
    (seed, maxEntries) => {
      const graph = fromEdgeList(randomArcs(64, 1, 1000, seed, false));
      room.maxEntries = Number.POSITIVE_INFINITY;
      const roomy = computeBarcode(graph, { semantics: "distance", maxDim: 2, prime: 2 });
      room.maxEntries = maxEntries;
      const tight = computeBarcode(graph, { semantics: "distance", maxDim: 2, prime: 2 });
      room.maxEntries = Number.POSITIVE_INFINITY;
      expect(tight.stats.storedColumns[2]).toBeLessThan(roomy.stats.storedColumns[2]);
      expect(tight.bars).toEqual(roomy.bars);
      // Direct ranks of the boundary matrices (bettiAt) at values across the filtration.
      for (const threshold of [300, 400, 431, 460, 489, 550, 700]) {
        expect(bettiFromBarcode(tight, threshold), `Betti numbers at ${threshold}`).toEqual(
          bettiAt(graph, { threshold, semantics: "distance", maxDim: 2, prime: 2 }),
        );
      }
    },
  );

  it("checks the clock at the same points, after the same additions, whether or not columns keep their entries", () => {
    // Reading a stored column instead of regenerating its chain changes how an addition is made, not which
    // additions are made (the working column's entries are the same sums): so the additions counted and
    // the clock checks, made every so many columns and additions (WorkMonitor's contract: a time limit
    // noticed within a bounded amount of work), must be the same with room for entries as with none. K_40,
    // distances 1–1000 (seed 1): more than 64 additions in each dimension, of stored and of other columns.
    const graph = fromEdgeList(randomArcs(40, 1, 1000, 1, false));
    const checks = (maxEntries: number) => {
      // A clock that moves 1.1 s per reading, so that every check reports (the default interval is 1 s).
      let clock = 0;
      const now = vi.spyOn(Date, "now").mockImplementation(() => {
        clock += 1100;
        return clock;
      });
      const seen: WorkProgress[] = [];
      room.maxEntries = maxEntries;
      const barcode = computeBarcode(graph, {
        semantics: "distance",
        maxDim: 2,
        prime: 2,
        onProgress: (p) => seen.push(p),
      });
      room.maxEntries = Number.POSITIVE_INFINITY;
      now.mockRestore();
      return { barcode, reports: seen.filter((p) => p.stage === "reducing columns") };
    };
    const roomy = checks(Number.POSITIVE_INFINITY);
    const none = checks(0);
    expect(roomy.barcode.stats.storedColumns[1]).toBeGreaterThan(0);
    expect(roomy.barcode.stats.storedColumns[2]).toBeGreaterThan(0);
    expect(none.barcode.stats.storedColumns).toEqual([0, 0, 0]);
    expect(roomy.barcode.stats.columnAdditions[1]).toBeGreaterThan(64);
    expect(none.barcode.stats.columnAdditions).toEqual(roomy.barcode.stats.columnAdditions);
    expect(none.reports.map((p) => [p.dim, p.done])).toEqual(roomy.reports.map((p) => [p.dim, p.done]));
  });

  it("an extension without room for the entries of its first value pushes the chain band by band instead (ties, Z/3)", () => {
    // Complete graph of 40 vertices with distances 1–4 only (test/support/random-arcs.ts, seed 2), room for
    // 40 entries: the entries of one value past a stored column's cover do not fit in an extension (a
    // counter put there by hand counted such refusals in this run), so the cursor must give up and the
    // column's chain be pushed band by band. Found by replaying changes of the reduction: handing the cursor
    // an empty segment instead left β2 at 3 as 1 (it is 0), and repeating the band never ended.
    const graph = fromEdgeList(randomArcs(40, 1, 4, 2, false));
    room.maxEntries = 40;
    const tight = computeBarcode(graph, { semantics: "distance", maxDim: 2, prime: 3 });
    room.maxEntries = Number.POSITIVE_INFINITY;
    expect(tight.stats.storedColumns[2]).toBeGreaterThan(0);
    // Direct ranks of the boundary matrices over Z/3 (bettiAt) at each of the four values.
    for (const threshold of [1, 2, 3, 4]) {
      expect(bettiFromBarcode(tight, threshold), `Betti numbers at ${threshold}`).toEqual(
        bettiAt(graph, { threshold, semantics: "distance", maxDim: 2, prime: 3 }),
      );
    }
  });
});

import { describe, expect, it, vi } from "vitest";
import { randomArcs } from "../../../../test/support/random-arcs.js";
import { tickingClock } from "../../../../test/support/ticking-clock.js";
import { fromEdgeList } from "../graph/from-edge-list.js";
import type { WorkProgress } from "../work/work-control.js";
import { bettiAt } from "./betti-at.js";
import { bettiFromBarcode } from "./betti-curves.js";
import { ChainBuilder } from "./chain-builder.js";
import { CliqueCoboundaries } from "./clique-coboundaries.js";
import { ColumnStore } from "./column-store.js";
import { computeBarcode } from "./compute-barcode.js";

/**
 * Stored entries take at most a quarter of the memory budget, but on graphs small enough for a test they
 * never come near it (a complete graph of 64 vertices stores about 6,000): here the store's limit is
 * lowered instead, so that columns find no room for their entries and extensions are refused. A column
 * read past its cover then has its chain pushed one band of values at a time behind a marker.
 */
const room = vi.hoisted(() => ({ maxEntries: Number.POSITIVE_INFINITY, extensions: true }));
vi.mock("./reduced-entries.js", async (original) => {
  const module = await original<typeof import("./reduced-entries.js")>();
  class LimitedEntries extends module.ReducedEntries {
    override reserveEntries(count: number): boolean {
      return this.used + count <= room.maxEntries && super.reserveEntries(count);
    }
    // `extensions: false`: no room for any extension, whatever its size (columns keep their first entries).
    override extend(id: number, more: InstanceType<typeof module.ReducedEntries>, cover: number): number {
      return room.extensions ? super.extend(id, more, cover) : -1;
    }
  }
  return { ...module, ReducedEntries: LimitedEntries };
});

/**
 * What the working column's chain (ChainBuilder) goes through in a run: columns started (`clear`),
 * compactions with the chain's length before and after, the length after each entry appended (not while a
 * tally is open, when entries go to its table), and the chains columns keep (`ColumnStore.setChain`: a
 * compaction followed at once by one is the kept chain's, made whatever its length).
 */
type ChainEvent =
  | { kind: "clear" }
  | { kind: "compact"; before: number; after: number }
  | { kind: "push"; size: number }
  | { kind: "keep"; size: number };

function chainEvents(run: () => void): ChainEvent[] {
  const events: ChainEvent[] = [];
  const builder = ChainBuilder.prototype;
  const { clear, compact, push } = builder;
  const setChain = ColumnStore.prototype.setChain;
  const spies = [
    vi.spyOn(builder, "clear").mockImplementation(function (this: ChainBuilder) {
      clear.call(this);
      events.push({ kind: "clear" });
    }),
    vi.spyOn(builder, "compact").mockImplementation(function (this: ChainBuilder, p: number) {
      const before = this.size;
      compact.call(this, p);
      events.push({ kind: "compact", before, after: this.size });
    }),
    vi.spyOn(builder, "push").mockImplementation(function (
      this: ChainBuilder,
      key: number,
      f: number,
      coef: number,
    ) {
      push.call(this, key, f, coef);
      if (!(this as unknown as { tallying: boolean }).tallying)
        events.push({ kind: "push", size: this.size });
    }),
    vi.spyOn(ColumnStore.prototype, "setChain").mockImplementation(function (
      this: ColumnStore,
      ...args: Parameters<ColumnStore["setChain"]>
    ) {
      events.push({ kind: "keep", size: args[4] });
      setChain.apply(this, args);
    }),
  ];
  try {
    run();
  } finally {
    for (const spy of spies) spy.mockRestore();
  }
  return events;
}

/**
 * The contract of the chain's compaction in cohomology-reduction.ts: a working column's chain is compacted
 * (sorted, equal simplices summed) only once it is longer than its threshold — 1,024 entries, or twice its
 * length after its last compaction if that is more — so that each entry pushed costs O(1) compaction work
 * amortised; and it is checked after every addition of a column's chain, so that it never holds more than
 * its threshold and about one added chain. Walks the events column by column: each compaction not followed
 * by a kept chain with its length before, and each length reached, with the threshold then.
 */
function compactionsAndLengths(events: ChainEvent[]) {
  const compactions: { before: number; threshold: number }[] = [];
  const lengths: { size: number; threshold: number }[] = [];
  let threshold = 1024;
  events.forEach((event, i) => {
    if (event.kind === "clear") threshold = 1024;
    else if (event.kind === "push") lengths.push({ size: event.size, threshold });
    else if (event.kind === "compact" && events[i + 1]?.kind !== "keep") {
      compactions.push({ before: event.before, threshold });
      threshold = Math.max(1024, 2 * event.after);
    }
  });
  const longestKept = events.reduce((m, event) => (event.kind === "keep" ? Math.max(m, event.size) : m), 0);
  return { compactions, lengths, longestKept };
}

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
      const roomy = computeBarcode(graph, { semantics: "distance", maxDim: 2, prime: 2, bandSweep: "off" });
      room.maxEntries = maxEntries;
      const tight = computeBarcode(graph, { semantics: "distance", maxDim: 2, prime: 2, bandSweep: "off" });
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
      const now = tickingClock();
      const seen: WorkProgress[] = [];
      room.maxEntries = maxEntries;
      const barcode = computeBarcode(graph, {
        semantics: "distance",
        maxDim: 2,
        prime: 2,
        bandSweep: "off",
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

  it("extends stored columns so that far fewer coboundaries are pushed than with no room for extensions", () => {
    // What extensions are for (cohomology-reduction.ts): a stored column read past its cover has its next
    // entries computed once and kept, instead of every column that adds it pushing its chain's coboundary
    // band by band. Counted as the coboundaries the reduction asks the clique model for, on the complete
    // graph of 64 vertices, distances 1–1000 (seed 3). Measured at main 8044451: 18,429 with extensions,
    // 59,645 with every extension refused (0.31); the bound, at most half, leaves room for a retuning of the
    // bands. With extensions never attempted, or stored columns never read, 36,221 and 43,456 are pushed
    // either way (0.61 and 0.73 of 59,645).
    const graph = fromEdgeList(randomArcs(64, 1, 1000, 3, false));
    const pushes = (extensions: boolean) => {
      room.extensions = extensions;
      const spy = vi.spyOn(CliqueCoboundaries.prototype, "pushCoboundary");
      const barcode = computeBarcode(graph, { semantics: "distance", maxDim: 2, prime: 2, bandSweep: "off" });
      const count = spy.mock.calls.length;
      spy.mockRestore();
      room.extensions = true;
      return { barcode, count };
    };
    const extended = pushes(true);
    const refused = pushes(false);
    expect(refused.barcode.bars).toEqual(extended.barcode.bars);
    expect(refused.barcode.stats.storedColumns).toEqual(extended.barcode.stats.storedColumns);
    expect(extended.count).toBeLessThanOrEqual(refused.count / 2);
  });

  it("keeps the working column's heap to a window of values: K_90 with no room for entries fits in 16 MiB", () => {
    // Without stored entries every addition pushes its chain's coboundary, and only cofaces up to a
    // horizon (a window of column values, doubled as needed) are heaped. K_90, distances 1–1000 (seed 5),
    // no room for entries: peak 7,452,816 bytes measured at main 8044451; the budget is 16 MiB, over twice
    // that. Heaping every coface at once (the horizon at +∞ from the start, or after the first widening)
    // peaks at 46,774,416 bytes.
    const graph = fromEdgeList(randomArcs(90, 1, 1000, 5, false));
    room.maxEntries = 0;
    const tight = computeBarcode(graph, {
      semantics: "distance",
      maxDim: 2,
      prime: 2,
      bandSweep: "off",
      budget: { maxBytes: 16 * 2 ** 20 },
    });
    room.maxEntries = Number.POSITIVE_INFINITY;
    expect(tight.stats.storedColumns).toEqual([0, 0, 0]);
    expect(tight.stats.columnAdditions[2]).toBeGreaterThan(10_000);
  });

  describe("the working column's chain, with no room for entries (K_64, distances 1–1000, seed 3)", () => {
    // Without stored entries every addition appends the added column's chain to the working column's, so
    // chains grow past 1,024 entries and are compacted on the way (at main 073d58c: 15 compactions before a
    // column's end, chains of up to 1,281 entries, the longest kept 586).
    const graph = fromEdgeList(randomArcs(64, 1, 1000, 3, false));
    const traced = () => {
      room.maxEntries = 0;
      let stored: number[] = [];
      const events = chainEvents(() => {
        stored = computeBarcode(graph, { semantics: "distance", maxDim: 2, prime: 2, bandSweep: "off" }).stats
          .storedColumns;
      });
      room.maxEntries = Number.POSITIVE_INFINITY;
      expect(stored).toEqual([0, 0, 0]);
      return compactionsAndLengths(events);
    };

    it("compacts a chain only once it is past 1,024 entries and twice its length after its last compaction", () => {
      const { compactions } = traced();
      expect(compactions.length).toBeGreaterThan(0);
      const early = compactions.filter((c) => c.before <= c.threshold);
      expect(early, "compactions at or below the threshold").toEqual([]);
    });

    it("compacts it before it grows past its threshold by more than one added chain", () => {
      // After each addition of a column's chain the chain is compacted if it is past its threshold, so it
      // exceeds the threshold by at most the chain just added (at most the longest chain a column keeps)
      // and the single entries of apparent pairs added since (measured: at most 257 past the threshold).
      const { lengths, longestKept } = traced();
      expect(lengths.reduce((m, l) => Math.max(m, l.size), 0)).toBeGreaterThan(1024);
      const over = lengths.filter((l) => l.size > l.threshold + longestKept);
      expect(over.length, `lengths past threshold + ${longestKept}`).toBe(0);
    });
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

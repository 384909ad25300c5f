/**
 * Large cases of the TypeScript counter (bitset-counter.ts), kept out of mutation runs
 * (vitest.mutation.config.ts leaves out `*.large.test.ts`): under a mutation run's instrumentation a
 * root's expansion over 2^27 words takes longer than the test time limit, where it takes seconds here.
 */
import { describe, expect, it } from "vitest";
import { fromEdgeList } from "../graph/from-edge-list.js";
import { countSimplices } from "./count-simplices.js";

describe("list entries outside a universe of 65 536 members set no bit", () => {
  // Worked by hand. Vertex 0 has arcs to the 65 536 even vertices 2 … 131 072 (member m is vertex 2m + 2),
  // so its bit matrix is 65 536 rows of 2,048 words, 2^27 words: the word index of a member −1 (an entry
  // outside the universe), −1 >>> 5 = 2^27 − 1, is the matrix's last word, not past its end. Vertex 2
  // (member 0) has arcs to 17 vertices, the odd ones outside the universe, placed so that each of the four
  // places of the unrolled scan and the remainder meets one: 3 4 6 8 | 10 11 12 14 | 16 18 19 20 |
  // 22 24 26 27 | 29. Simplices: 131 073 vertices; 65 536 + 17 arcs; the triangles (0, 2, x) for the 12
  // even x in vertex 2's list; no arc among them, so nothing more. An entry outside the universe taken for
  // a member would set bit 31 of that last word, i.e. member 65 535 in member 65 535's own row, and a 13th
  // triangle would be counted.
  it("counts 131 073, 65 553, 12", () => {
    const mine = [3, 4, 6, 8, 10, 11, 12, 14, 16, 18, 19, 20, 22, 24, 26, 27, 29];
    const hub = Array.from({ length: 65_536 }, (_, m) => 2 * m + 2);
    const sources = [...hub.map(() => 0), ...mine.map(() => 2)];
    const targets = [...hub, ...mine];
    const g = fromEdgeList({ n: 131_073, directed: true, sources, targets, weights: sources.map(() => 1) });
    const r = countSimplices(g, { kernel: "typescript" });
    expect(Array.from(r.counts)).toEqual([131_073, 65_553, 12]);
    expect(r.truncated).toBe(false);
  });
});

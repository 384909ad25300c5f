import { describe, expect, it } from "vitest";
import { averageRanks } from "./average-ranks.js";

function ranks(values: number[]): number[] {
  const out = new Float64Array(values.length);
  averageRanks(Float64Array.from(values), 0, values.length, out, 0, new Float64Array(values.length));
  return Array.from(out);
}

describe("averageRanks", () => {
  it("gives tied values the mean of their ranks (scipy.stats.rankdata's example, recalled from memory)", () => {
    expect(ranks([0, 2, 3, 2])).toEqual([1, 2.5, 4, 2.5]);
  });

  it("ranks 1..n without ties, all equal values share (n + 1) / 2, and a window of a longer array", () => {
    expect(ranks([0.3, -1, 7, 2])).toEqual([2, 1, 4, 3]);
    expect(ranks([5, 5, 5, 5, 5])).toEqual([3, 3, 3, 3, 3]);
    const out = new Float64Array(8).fill(-1);
    averageRanks(Float64Array.from([9, 9, 4, 1, 4, 9]), 2, 3, out, 4, new Float64Array(6));
    expect(Array.from(out)).toEqual([-1, -1, -1, -1, 2.5, 1, 2.5, -1]);
  });
});

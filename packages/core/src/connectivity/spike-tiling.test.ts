import { describe, expect, it } from "vitest";
import { seededRandom } from "../../../../test/support/random.js";
import { series } from "./connectivity.fixture.js";
import { spikeTilingMatrix } from "./spike-tiling.js";

function train(T: number, spikes: number[]): number[] {
  const row = new Array(T).fill(0);
  for (const t of spikes) row[t] += 1;
  return row;
}

describe("spikeTilingMatrix (Cutts & Eglen 2014)", () => {
  it("a worked example computed by hand from the paper's formula", () => {
    // T = 10 bins, window ±1. A spikes at 2, 7: tiles {1,2,3,6,7,8}, T_A = 0.6. B spikes at 3, 9: tiles
    // {2,3,4,8,9}, T_B = 0.5. P_A = 1/2 (2 is in B's tiles, 7 is not); P_B = 1/2 (3 is in A's, 9 is not).
    // STTC = ½ [(0.5 − 0.5)/(1 − 0.25) + (0.5 − 0.6)/(1 − 0.3)] = −1/14.
    const { values } = spikeTilingMatrix(series([train(10, [2, 7]), train(10, [3, 9])]), 1);
    expect(values[1]).toBeCloseTo(-1 / 14, 14);
    expect(values[2]).toBe(values[1]);
    expect(values[0]).toBe(1);
  });

  it("a train with a copy of itself scores 1; a count of 2 in a bin is two spikes", () => {
    const a = train(50, [3, 10, 11, 30]);
    const { values } = spikeTilingMatrix(series([a, a.slice()]), 2);
    expect(values[1]).toBe(1);
    // C: a double spike at 20 (outside A's tiles) and one at 10 (inside): P_C = 1/3.
    const c = train(50, [10, 20, 20]);
    const tilesA = 5 + 6 + 5; // [1,5] ∪ [8,13] ∪ [28,32]
    const tilesC = 5 + 5; // [8,12] ∪ [18,22]
    const PA = 2 / 4; // A's spikes at 10 and 11 lie in C's tiles, 3 and 30 do not
    const PC = 1 / 3; // C's spike at 10 lies in A's tiles, its two at 20 do not
    const TA = tilesA / 50;
    const TC = tilesC / 50;
    const expected = 0.5 * ((PA - TC) / (1 - PA * TC) + (PC - TA) / (1 - PC * TA));
    expect(spikeTilingMatrix(series([a, c]), 2).values[1]).toBeCloseTo(expected, 14);
  });

  it("independent trains score near 0 whatever their rates; a window covering everything is reported", () => {
    const next = seededRandom(3);
    const T = 20000;
    const rows = [0.01, 0.05, 0.2].map((rate) => Array.from({ length: T }, () => (next() < rate ? 1 : 0)));
    const { values, fullCoverage } = spikeTilingMatrix(series(rows), 2);
    for (const k of [1, 2, 5]) expect(Math.abs(values[k])).toBeLessThan(0.05);
    expect(fullCoverage).toEqual([]);
    const dense = spikeTilingMatrix(series([train(9, [1, 4, 7]), train(9, [0, 5])]), 1);
    expect(dense.fullCoverage).toEqual([0]);
    expect(Number.isFinite(dense.values[1])).toBe(true);
  });
});

import { describe, expect, it } from "vitest";
import { seededRandom } from "../../../../test/support/random.js";
import { countBelow } from "./count-below.js";

// Against its definition, the number of entries < x counted one by one (what Python's bisect.bisect_left
// returns on an ascending list: common practice).
describe("countBelow", () => {
  it("counts the entries < x of ascending lists with repeats, for x below, between, on and above them", () => {
    const random = seededRandom(54321);
    const below = (k: number) => Math.floor(random() * k);
    for (let trial = 0; trial < 200; trial++) {
      const sorted = Float64Array.from({ length: below(12) }, () => below(6)).sort();
      for (let x = -1; x <= 6; x += 0.5) {
        expect(countBelow(sorted, x)).toBe(sorted.filter((v) => v < x).length);
      }
    }
  });

  it("reads plain arrays too, and is 0 on an empty list", () => {
    expect(countBelow([1, 2, 2, 3], 2)).toBe(1);
    expect(countBelow([], 5)).toBe(0);
    expect(countBelow([-Infinity, 0, Infinity], Infinity)).toBe(2);
  });
});

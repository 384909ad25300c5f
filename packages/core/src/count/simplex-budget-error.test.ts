import { describe, expect, it } from "vitest";
import { rootProgress, SimplexBudgetError } from "./simplex-budget-error.js";

const TAIL = "Raise the budget, lower maxDim, or use a sparser threshold.";

describe("SimplexBudgetError says how far the count got", () => {
  it("partway: the share done, a rough extrapolation that scales only the simplices not counted up front", () => {
    // by hand: 10 + 30 + 70 = 110 counted; 40 of them up front (exact), the other 70 from a quarter of
    // the roots, so about 40 + 70 / 0.25 = 320 in all
    const err = new SimplexBudgetError(100, Float64Array.of(10, 30, 70), 0.25, 40);
    expect(err.message).toBe(
      "simplex budget of 100 exceeded after 110 simplices with 25.0% of root vertices done " +
        `(a rough extrapolation: 3.20e+2 in all); counted so far dim 0: 10, dim 1: 30, dim 2: 70. ${TAIL}`,
    );
    expect(err).toBeInstanceOf(Error);
    expect(err.name).toBe("SimplexBudgetError");
    expect(err.budget).toBe(100);
    expect(Array.from(err.counted)).toEqual([10, 30, 70]);
    expect(err.progress).toBe(0.25);
  });

  it("with nothing counted up front the whole count is scaled; another unit is named as given", () => {
    // by hand: 5 + 12 = 17 counted from 40 % of the filtration steps: 17 / 0.4 = 42.5
    const err = new SimplexBudgetError(16, Float64Array.of(5, 12), 0.4, 0, "filtration steps");
    expect(err.message).toBe(
      "simplex budget of 16 exceeded after 17 simplices with 40.0% of filtration steps done " +
        `(a rough extrapolation: 4.25e+1 in all); counted so far dim 0: 5, dim 1: 12. ${TAIL}`,
    );
  });

  it("no root finished: the share is 0.0% and there is no extrapolation (it would be infinite)", () => {
    const err = new SimplexBudgetError(5, Float64Array.of(4, 6), 0, 10);
    expect(err.message).toBe(
      `simplex budget of 5 exceeded after 10 simplices with 0.0% of root vertices done; counted so far dim 0: 4, dim 1: 6. ${TAIL}`,
    );
  });

  it("every root finished: the count is complete, only the budget was too small", () => {
    const err = new SimplexBudgetError(14, Float64Array.of(4, 6, 4, 1), 1, 10);
    expect(err.message).toBe(
      "simplex budget of 14 exceeded after 15 simplices with all root vertices done (the count is complete; " +
        `only the budget is too small); counted so far dim 0: 4, dim 1: 6, dim 2: 4, dim 3: 1. ${TAIL}`,
    );
  });
});

describe("rootProgress: the share of the roots with work that is finished", () => {
  // list lengths 3, 0, 2, 1, 2 (roots 0..4)
  const offsets = Int32Array.of(0, 3, 3, 5, 6, 8);

  it("counts only roots whose list has at least minList entries (a list of exactly minList counts)", () => {
    // minList 2: roots 0, 2 and 4 have work. Before root 2: root 0 done (1 of 3); root 2 finished too: 2 of 3.
    expect(rootProgress(offsets, 5, 2, false, 2)).toBe(1 / 3);
    expect(rootProgress(offsets, 5, 2, true, 2)).toBe(2 / 3);
    // minList 1: roots 0, 2, 3, 4. Root 3 finished: 0, 2 and 3 of the four.
    expect(rootProgress(offsets, 5, 3, true, 1)).toBe(3 / 4);
    expect(rootProgress(offsets, 5, 3, false, 1)).toBe(2 / 4);
  });

  it("before the first root nothing is done; after the last root with work everything is", () => {
    expect(rootProgress(offsets, 5, -1, false, 2)).toBe(0);
    expect(rootProgress(offsets, 5, 0, false, 2)).toBe(0);
    expect(rootProgress(offsets, 5, 4, true, 2)).toBe(1);
  });

  it("is 1 (all done) when no root has work, not 0 / 0", () => {
    expect(rootProgress(Int32Array.of(0, 1, 2, 2), 3, 0, false, 2)).toBe(1);
    expect(rootProgress(Int32Array.of(0), 0, -1, false, 1)).toBe(1);
  });
});

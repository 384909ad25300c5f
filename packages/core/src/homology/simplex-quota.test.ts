import { describe, expect, it } from "vitest";
import { errorOf } from "../../../../test/support/error-of.js";
import { SimplexBudgetError } from "../count/simplex-budget-error.js";
import { SimplexQuota } from "./simplex-quota.js";

describe("SimplexQuota", () => {
  it("lets the total reach the budget exactly and stops one simplex past it (totals worked by hand)", () => {
    const quota = new SimplexQuota(100, 3);
    quota.charge(0, 10, 1, "vertices");
    quota.charge(1, 40, 1, "edges");
    // A dimension charged again replaces its count: 10 + 90 = 100, not 10 + 40 + 90.
    quota.charge(1, 90, 1, "edges");
    expect(quota.budget).toBe(100);
    const error = errorOf(() => quota.charge(2, 1, 0.5, "edges"), SimplexBudgetError);
    expect(error).toBeInstanceOf(SimplexBudgetError);
    expect(error?.budget).toBe(100);
    // The counts of dimensions 0 … 2 as charged, the dimension that passed the budget last.
    expect(Array.from(error?.counted ?? [])).toEqual([10, 90, 1]);
    expect(error?.progress).toBe(0.5);
    // 100 simplices were complete before this charge (exact); the 1 triangle came from half of the edges,
    // so the extrapolation is 100 + 1 / 0.5 = 102 (worked by hand).
    expect(error?.message).toBe(
      "simplex budget of 100 exceeded after 101 simplices with 50.0% of edges done " +
        "(a rough extrapolation: 1.02e+2 in all); counted so far dim 0: 10, dim 1: 90, dim 2: 1. " +
        "Raise the budget, lower maxDim, or use a sparser threshold.",
    );
  });

  it("reports the dimensions up to the one charged, as clique listing charges them in order", () => {
    // A quota for dimensions 0 … 4 stopped at dimension 1: dims 2 … 4, not listed yet, are left out.
    const quota = new SimplexQuota(12, 4);
    quota.charge(0, 6, 1, "vertices");
    const error = errorOf(() => quota.charge(1, 7, 1, "vertices"), SimplexBudgetError);
    expect(Array.from(error?.counted ?? [])).toEqual([6, 7]);
    expect(error?.message).toContain("exceeded after 13 simplices with all vertices done");
  });

  it("reports the higher dimensions already counted when a lower one passes the budget (worked by hand)", () => {
    // As directed tables charge every dimension in turn: 64 vertices and 100 edges fit a budget of 200;
    // 128 vertices with those 100 edges (228) do not. The counts reported add up to those 228.
    const quota = new SimplexQuota(200, 3);
    quota.charge(0, 64, 0.5, "root vertices");
    quota.charge(1, 100, 0.5, "root vertices");
    const error = errorOf(() => quota.charge(0, 128, 0.75, "root vertices"), SimplexBudgetError);
    expect(Array.from(error.counted)).toEqual([128, 100]);
    // 100 simplices outside this charge; the 128 came from 75 % of the roots: 100 + 128 / 0.75 ≈ 270.7.
    expect(error.message).toBe(
      "simplex budget of 200 exceeded after 228 simplices with 75.0% of root vertices done " +
        "(a rough extrapolation: 2.71e+2 in all); counted so far dim 0: 128, dim 1: 100. " +
        "Raise the budget, lower maxDim, or use a sparser threshold.",
    );
  });

  it("has no limit without a budget and refuses a negative or NaN one", () => {
    const quota = new SimplexQuota(undefined, 1);
    expect(quota.budget).toBe(Number.POSITIVE_INFINITY);
    expect(() => quota.charge(1, 1e15, 1, "edges")).not.toThrow();
    // A budget of 0 is allowed: the empty complex fits.
    expect(() => new SimplexQuota(0, 1).charge(0, 0, 1, "vertices")).not.toThrow();
    for (const bad of [-1, Number.NaN])
      expect(() => new SimplexQuota(bad, 1)).toThrow(
        new RangeError(`maxSimplices must be a non-negative number, got ${bad}`),
      );
  });
});

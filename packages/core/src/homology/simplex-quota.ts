import { SimplexBudgetError } from "../count/simplex-budget-error.js";

/**
 * The simplex budget of a homology computation: how many simplices its tables may list in all dimensions.
 * Memory is bounded separately (ByteLedger); this bounds the work, as the counting budget does.
 */
export class SimplexQuota {
  readonly budget: number;
  /** Simplices listed per dimension so far. */
  private readonly listed: Float64Array;

  constructor(budget: number | undefined, topDim: number) {
    const max = budget ?? Number.POSITIVE_INFINITY;
    if (!(max >= 0)) throw new RangeError(`maxSimplices must be a non-negative number, got ${max}`);
    this.budget = max;
    this.listed = new Float64Array(topDim + 1);
  }

  /**
   * Records that `count` simplices of dimension `dim` are listed; throws SimplexBudgetError when the total
   * passes the budget. `progress` (0..1) is the share of `unit` done when the listing is not finished.
   */
  charge(dim: number, count: number, progress: number, unit: string): void {
    this.listed[dim] = count;
    let total = 0;
    for (let k = 0; k < this.listed.length; k++) total += this.listed[k];
    if (total <= this.budget) return;
    // Every dimension counted so far, not only those up to `dim`: the counts reported add up to the total
    // that passed the budget (directed tables charge dimension 0 again while the higher ones hold counts).
    let top = this.listed.length - 1;
    while (top > 0 && this.listed[top] === 0) top--;
    const exact = total - count;
    throw new SimplexBudgetError(this.budget, this.listed.slice(0, top + 1), progress, exact, unit);
  }
}

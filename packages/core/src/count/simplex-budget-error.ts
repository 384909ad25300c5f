/**
 * Thrown when an enumeration passes its simplex budget. It says how far the count got, per dimension, and
 * which share of the root vertices was finished, so a caller can judge how much larger the full run is.
 */
export class SimplexBudgetError extends Error {
  /** The budget that was exceeded (simplices, all dimensions). */
  readonly budget: number;
  /** Simplices counted per dimension before stopping (a lower bound on the true counts). */
  readonly counted: Float64Array;
  /** Share of root vertices fully processed when the budget ran out (0..1). */
  readonly progress: number;

  constructor(budget: number, counted: Float64Array, progress: number) {
    const total = counted.reduce((a, b) => a + b, 0);
    const perDim = Array.from(counted, (c, k) => `dim ${k}: ${c}`).join(", ");
    const pct = (progress * 100).toFixed(1);
    const estimate =
      progress > 0 ? ` (a rough extrapolation: ${(total / progress).toExponential(2)} in all)` : "";
    super(
      `simplex budget of ${budget} exceeded after ${total} simplices with ${pct}% of root vertices done${estimate}; ` +
        `counted so far ${perDim}. Raise the budget, lower maxDim, or use a sparser threshold.`,
    );
    this.name = "SimplexBudgetError";
    this.budget = budget;
    this.counted = counted;
    this.progress = progress;
  }
}

/**
 * Thrown when an enumeration passes its simplex budget. It says how far the count got, per dimension, and
 * which share of the root vertices was finished, so a caller can judge how much larger the full run is.
 */
export class SimplexBudgetError extends Error {
  /** The budget that was exceeded (simplices, all dimensions). */
  readonly budget: number;
  /** Simplices counted per dimension before stopping (a lower bound on the true counts). */
  readonly counted: Float64Array;
  /**
   * Share (0..1) of the root vertices with simplices to extend whose whole subtree was counted when the
   * budget ran out, the root being enumerated included if it had just finished. 1 means the count was
   * complete: `counted` is then exact and only the budget was too small.
   */
  readonly progress: number;

  /**
   * `exact`: simplices counted outside the per-root enumeration (e.g. all vertices and edges up front);
   * the extrapolation scales only the rest. `unit`: what `progress` is a share of, when not root vertices.
   */
  constructor(budget: number, counted: Float64Array, progress: number, exact = 0, unit = "root vertices") {
    const total = counted.reduce((a, b) => a + b, 0);
    const perDim = Array.from(counted, (c, k) => `dim ${k}: ${c}`).join(", ");
    let done: string;
    if (progress >= 1) done = `with all ${unit} done (the count is complete; only the budget is too small)`;
    else {
      const estimate =
        progress > 0
          ? ` (a rough extrapolation: ${(exact + (total - exact) / progress).toExponential(2)} in all)`
          : "";
      done = `with ${(progress * 100).toFixed(1)}% of ${unit} done${estimate}`;
    }
    super(
      `simplex budget of ${budget} exceeded after ${total} simplices ${done}; ` +
        `counted so far ${perDim}. Raise the budget, lower maxDim, or use a sparser threshold.`,
    );
    this.name = "SimplexBudgetError";
    this.budget = budget;
    this.counted = counted;
    this.progress = progress;
  }
}

/**
 * Share of the roots with work (list length ≥ minList) finished before root `v`, counting `v` itself when
 * `finished`; 1 when no root has work.
 */
export function rootProgress(
  offsets: Int32Array,
  n: number,
  v: number,
  finished: boolean,
  minList: number,
): number {
  let withWork = 0;
  let done = 0;
  const last = finished ? v : v - 1;
  for (let u = 0; u < n; u++) {
    if (offsets[u + 1] - offsets[u] < minList) continue;
    withWork++;
    if (u <= last) done++;
  }
  return withWork === 0 ? 1 : done / withWork;
}

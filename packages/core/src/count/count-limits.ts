import { DEFAULT_SIMPLEX_BUDGET } from "./defaults.js";
import type { CountOptions } from "./types.js";

/** Simplices counted between two checks of the budget and the clock: a slow-path call per million. */
export const CHECK_EVERY = 2 ** 20;

/** Checks the limits and fills in defaults: no dimension cap, DEFAULT_SIMPLEX_BUDGET simplices. */
export function resolveLimits(options: CountOptions): { maxDim: number; budget: number } {
  const maxDim = options.maxDim ?? Number.POSITIVE_INFINITY;
  const budget = options.budget ?? DEFAULT_SIMPLEX_BUDGET;
  if (!(maxDim === Number.POSITIVE_INFINITY || (Number.isInteger(maxDim) && maxDim >= 0))) {
    throw new RangeError(`maxDim must be a non-negative integer, got ${maxDim}`);
  }
  if (!(budget >= 0)) throw new RangeError(`budget must be a non-negative number, got ${budget}`);
  return { maxDim, budget };
}

import { GraphInputError, type GraphInputLocation } from "./graph-input-error.js";
import type { NegativePolicy } from "./policies.js";

/**
 * Validates one weight and applies the negative-weight policy. Returns the weight to store, or NaN when
 * the edge is to be dropped. `where` is called only to build an error, so the happy path allocates nothing.
 */
export function checkWeight(w: number, negative: NegativePolicy, where: () => GraphInputLocation): number {
  if (!Number.isFinite(w)) {
    throw new GraphInputError("not-finite", `weight ${w} is not a finite number`, where());
  }
  if (w >= 0 || negative === "keep") return w;
  switch (negative) {
    case "abs":
      return -w;
    case "drop":
      return Number.NaN;
    default:
      throw new GraphInputError(
        "negative-weight",
        `negative weight ${w}; choose a negative-weight policy (abs, drop or keep) to accept it`,
        where(),
      );
  }
}

/** A distance between two diagrams would need more memory than allowed for its candidate pairs. */
export class DistanceBudgetError extends Error {
  override name = "DistanceBudgetError";
  constructor(
    readonly neededBytes: number,
    readonly maxBytes: number,
  ) {
    super(
      `matching these two diagrams needs over ${(neededBytes / 2 ** 20).toFixed(0)} MiB of candidate pairs, ` +
        `more than the ${(maxBytes / 2 ** 20).toFixed(0)} MiB allowed: both hold many long bars close to each other`,
    );
  }
}

/** Default memory for the candidate pairs of one distance: 1 GiB (about 33 million pairs). */
export const DEFAULT_DISTANCE_BYTES = 2 ** 30;

/** A distance between two diagrams would need more memory than allowed for its assignment matrix. */
export class DistanceBudgetError extends Error {
  override name = "DistanceBudgetError";
  constructor(
    readonly neededBytes: number,
    readonly maxBytes: number,
  ) {
    super(
      `matching these two diagrams needs a ${(neededBytes / 2 ** 20).toFixed(0)} MiB cost matrix, over the ` +
        `${(maxBytes / 2 ** 20).toFixed(0)} MiB allowed: the diagrams hold one large cluster of nearby points`,
    );
  }
}

/** Default memory for one assignment matrix: 1 GiB (a component of about 11,000 points). */
export const DEFAULT_DISTANCE_BYTES = 2 ** 30;

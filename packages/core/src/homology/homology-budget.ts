/**
 * The memory a homology computation may hold in its tables, heaps and columns. Every growable table asks
 * the budget before it grows, so an oversized job stops with a HomologyBudgetError that says what was being
 * built instead of running out of memory.
 */
export interface HomologyBudget {
  /** Bytes of typed arrays the computation may hold at once (default 2 GiB). */
  readonly maxBytes?: number;
}

export const DEFAULT_HOMOLOGY_BYTES = 2 * 1024 ** 3;

export class HomologyBudgetError extends Error {
  /** Bytes that would have been held had the computation gone on. */
  readonly neededBytes: number;
  readonly maxBytes: number;
  /** What was being built when the budget ran out. */
  readonly stage: string;

  constructor(stage: string, neededBytes: number, maxBytes: number) {
    super(
      `homology needs more than ${formatBytes(maxBytes)} (at least ${formatBytes(neededBytes)}) while ${stage}; ` +
        "lower maxDim, keep fewer edges, or raise budget.maxBytes",
    );
    this.name = "HomologyBudgetError";
    this.neededBytes = neededBytes;
    this.maxBytes = maxBytes;
    this.stage = stage;
  }
}

/** Running total of the bytes held, checked on every reservation. */
export class ByteLedger {
  readonly maxBytes: number;
  held = 0;
  peak = 0;

  constructor(budget: HomologyBudget | undefined) {
    const max = budget?.maxBytes ?? DEFAULT_HOMOLOGY_BYTES;
    if (!(max > 0)) throw new RangeError(`budget.maxBytes must be positive, got ${max}`);
    this.maxBytes = max;
  }

  reserve(bytes: number, stage: string): void {
    const next = this.held + bytes;
    if (next > this.maxBytes) throw new HomologyBudgetError(stage, next, this.maxBytes);
    this.held = next;
    if (next > this.peak) this.peak = next;
  }

  release(bytes: number): void {
    this.held -= bytes;
  }
}

function formatBytes(bytes: number): string {
  if (bytes >= 1024 ** 3) return `${(bytes / 1024 ** 3).toFixed(2)} GiB`;
  if (bytes >= 1024 ** 2) return `${(bytes / 1024 ** 2).toFixed(1)} MiB`;
  return `${Math.ceil(bytes / 1024)} KiB`;
}

import { createNpyStack, type NpyStack } from "@cliquescape/io";

/** The largest stack `connect` builds in memory; beyond it, one file per recording. */
export const MAX_STACK_BYTES = 4 * 2 ** 30;

/**
 * Gathers matrices into one (k, n, n) .npy stack as they arrive from the workers, in any order. The stack's
 * n is the stated channel count, or else that of the first recording in dataset order that succeeded —
 * decided only once every recording before it has finished, so the choice never depends on which worker
 * was faster. Until then matrices wait; a matrix of another size is left out with a reason.
 */
export class StackCollector {
  private readonly finished: Uint8Array;
  private readonly sizes: Int32Array;
  private readonly waiting = new Map<number, Float64Array>();
  private frontier = 0;
  private n: number | null;
  private stack: NpyStack | null = null;
  private readonly slots: number[] = [];
  /** Recordings left out of the stack, with why. */
  readonly refused = new Map<number, string>();

  constructor(
    private readonly total: number,
    private readonly stated: number | null,
  ) {
    this.finished = new Uint8Array(total);
    this.sizes = new Int32Array(total).fill(-1);
    this.n = stated;
  }

  add(index: number, n: number, values: Float64Array): void {
    this.finished[index] = 1;
    this.sizes[index] = n;
    if (this.n === null) {
      this.waiting.set(index, values);
      this.decide();
    } else this.place(index, n, values);
  }

  fail(index: number): void {
    this.finished[index] = 1;
    this.decide();
  }

  /** The .npy bytes of the stack (null when no matrix went in) and the recordings in it, in order. */
  finish(): { bytes: Uint8Array | null; slots: number[]; n: number | null } {
    // An interrupted run may stop before the size is decided: the first waiting recording decides then.
    if (this.n === null && this.waiting.size > 0) {
      let first = Number.POSITIVE_INFINITY;
      for (const index of this.waiting.keys()) if (index < first) first = index;
      this.settle(first);
    }
    if (!this.stack) return { bytes: null, slots: [], n: this.n };
    const slots = [...this.slots].sort((a, b) => a - b);
    return { bytes: this.stack.finish(slots), slots, n: this.n };
  }

  private decide(): void {
    while (this.n === null && this.frontier < this.total && this.finished[this.frontier]) {
      if (this.sizes[this.frontier] >= 0) this.settle(this.frontier);
      else this.frontier++;
    }
  }

  private settle(first: number): void {
    this.n = this.sizes[first];
    const waiting = [...this.waiting].sort(([a], [b]) => a - b);
    this.waiting.clear();
    for (const [index, values] of waiting) this.place(index, this.sizes[index], values);
  }

  private place(index: number, n: number, values: Float64Array): void {
    const size = this.n as number;
    if (n !== size) {
      const whose = this.stated === null ? "the first recording's" : "the stated channel count";
      this.refused.set(
        index,
        `${n} channels, but the stack holds ${size}-channel matrices (${whose}); write one file per recording (--layout files) when recordings differ in size`,
      );
      return;
    }
    if (!this.stack) {
      const bytes = this.total * size * size * 8;
      if (bytes > MAX_STACK_BYTES) {
        throw new StackBudgetError(
          `a stack of ${this.total} matrices of ${size} × ${size} would take ${(bytes / 2 ** 30).toFixed(1)} GiB; write one file per recording (--layout files)`,
        );
      }
      this.stack = createNpyStack([size, size], this.total);
    }
    this.stack.put(index, values);
    this.slots.push(index);
  }
}

/** The stack would not fit the memory `connect` allows it (exit code 3, like every budget). */
export class StackBudgetError extends Error {
  override name = "StackBudgetError";
}

/** What a long computation is doing: read by progress displays and by time-limit messages. */
export type WorkStage =
  | "counting simplices"
  | "listing simplices"
  | "pairing components"
  | "reducing columns"
  | "building directed tables"
  | "drawing null samples";

/** A snapshot of a computation's progress: `done` of `total` units of `stage` in dimension `dim`. */
export interface WorkProgress {
  readonly stage: WorkStage;
  /** Simplex dimension the stage works on (0 for counting, which spans all dimensions). */
  readonly dim: number;
  /** Units done so far: root vertices (counting), simplices listed, edges or columns processed. */
  readonly done: number;
  /** Units in the stage, or NaN when not known in advance (listing). */
  readonly total: number;
  /** Milliseconds since the computation started. */
  readonly elapsedMs: number;
}

/**
 * Time limit and progress reporting for one computation (a count, a sweep, a barcode). Both are optional;
 * without them the checks cost a clock read every few thousand units of work.
 */
export interface WorkControl {
  /** Stop with a TimeLimitError after this many milliseconds (default: no limit). */
  readonly timeLimitMs?: number;
  /**
   * Date.now() when the clock started (default: when the computation starts). Several computations given
   * the same value share one time limit, and report elapsed time from it.
   */
  readonly startedAt?: number;
  /** Called at most every `progressIntervalMs` while the computation runs. */
  readonly onProgress?: (progress: WorkProgress) => void;
  /** Default 1000 ms. */
  readonly progressIntervalMs?: number;
}

import { TimeLimitError } from "./time-limit-error.js";
import type { WorkControl, WorkProgress, WorkStage } from "./work-control.js";

const now = (): number => Date.now();

/**
 * The clock of one computation: callers announce each stage with begin() and call check() every few
 * thousand units of work (never per simplex). check() throws a TimeLimitError past the deadline and hands
 * a progress snapshot to the listener at most once per interval.
 */
export class WorkMonitor {
  private readonly started: number;
  private readonly deadline: number;
  private readonly limitMs: number;
  private readonly listener: ((progress: WorkProgress) => void) | undefined;
  private readonly interval: number;
  private nextReport: number;
  private stage: WorkStage = "counting simplices";
  private dim = 0;
  private total = Number.NaN;

  constructor(control: WorkControl | undefined) {
    const limit = control?.timeLimitMs ?? Number.POSITIVE_INFINITY;
    if (!(limit > 0)) throw new RangeError(`timeLimitMs must be positive, got ${limit}`);
    this.started = control?.startedAt ?? now();
    this.limitMs = limit;
    this.deadline = this.started + limit;
    this.listener = control?.onProgress;
    this.interval = control?.progressIntervalMs ?? 1000;
    this.nextReport = this.started + this.interval;
  }

  begin(stage: WorkStage, dim: number, total: number): void {
    this.stage = stage;
    this.dim = dim;
    this.total = total;
    this.check(0);
  }

  check(done: number): void {
    const t = now();
    if (t > this.deadline) throw new TimeLimitError(this.limitMs, this.snapshot(done, t));
    if (this.listener !== undefined && t >= this.nextReport) {
      this.nextReport = t + this.interval;
      this.listener(this.snapshot(done, t));
    }
  }

  private snapshot(done: number, t: number): WorkProgress {
    return { stage: this.stage, dim: this.dim, done, total: this.total, elapsedMs: t - this.started };
  }
}

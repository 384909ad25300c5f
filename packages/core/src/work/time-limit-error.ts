import type { WorkProgress } from "./work-control.js";

/**
 * Thrown when a computation passes its time limit. It carries where the computation was, so a caller can
 * say how far it got and how much longer the whole would take.
 */
export class TimeLimitError extends Error {
  readonly limitMs: number;
  readonly progress: WorkProgress;

  constructor(limitMs: number, progress: WorkProgress) {
    super(`time limit of ${formatSeconds(limitMs)} reached ${describeProgress(progress)}`);
    this.name = "TimeLimitError";
    this.limitMs = limitMs;
    this.progress = progress;
  }
}

/** "while reducing columns of dimension 2 (1,200 of 4,000 done, after 31.2 s)". */
export function describeProgress(p: WorkProgress): string {
  const where = describeStage(p);
  const count = Number.isFinite(p.total)
    ? `${p.done.toLocaleString("en-US")} of ${p.total.toLocaleString("en-US")} done`
    : `${p.done.toLocaleString("en-US")} so far`;
  return `while ${where} (${count}, after ${formatSeconds(p.elapsedMs)})`;
}

/** "reducing columns of dimension 2"; stages that span every dimension are named alone. */
export function describeStage(p: WorkProgress): string {
  return p.stage === "counting simplices" || p.stage === "drawing null samples"
    ? p.stage
    : `${p.stage} of dimension ${p.dim}`;
}

function formatSeconds(ms: number): string {
  return `${(ms / 1000).toFixed(ms < 10_000 ? 1 : 0)} s`;
}

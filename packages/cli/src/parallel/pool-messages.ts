import type { WorkProgress } from "@cliquescape/core";

/**
 * Tasks for one worker, done in order (see serve-batches.ts). Answers come back as arrays of replies,
 * gathered for at most a few tens of milliseconds.
 */
export interface WorkerBatch<Task> {
  kind: "batch";
  tasks: Task[];
}

/** Sent by a worker while it computes task `index` (at most once a second). */
export interface WorkerProgress {
  kind: "progress";
  index: number;
  progress: WorkProgress;
}

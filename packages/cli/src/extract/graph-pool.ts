import { type PoolOptions, runOnWorkerScript } from "../parallel/worker-pool.js";
import type { WorkerReply, WorkerSetup, WorkerTask } from "./worker-messages.js";

/** The compiled worker script next to this file in dist/. */
const WORKER_SCRIPT = new URL("./graph-worker.js", import.meta.url);

/** Runs extract's graph tasks (graph-worker.ts) on the worker pool. */
export function runOnWorkers(
  tasks: readonly WorkerTask[],
  onReply: (reply: WorkerReply) => void,
  options: PoolOptions<WorkerTask, WorkerReply, WorkerSetup>,
): Promise<"finished" | "stopped"> {
  return runOnWorkerScript(WORKER_SCRIPT, tasks, onReply, options);
}

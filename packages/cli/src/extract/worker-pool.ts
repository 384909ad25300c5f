import { Worker } from "node:worker_threads";
import type { WorkerReply, WorkerSetup, WorkerTask } from "./worker-messages.js";

/** The compiled worker script next to this file in dist/. */
const WORKER_SCRIPT = new URL("./graph-worker.js", import.meta.url);

/**
 * Runs tasks on `size` worker threads, one task per worker at a time, handing each reply to `onReply` in
 * the order replies arrive (the caller puts results in dataset order). Once `signal` aborts, no new task
 * starts and the tasks in flight are abandoned at once (their workers are terminated). A worker that dies (a crash, its heap limit) answers its task with a failure and is
 * replaced, so one pathological graph cannot end the run.
 */
export async function runOnWorkers(
  size: number,
  setup: WorkerSetup,
  tasks: readonly WorkerTask[],
  onReply: (reply: WorkerReply) => void,
  signal: AbortSignal,
  onCrash: (task: WorkerTask, message: string) => WorkerReply,
): Promise<"finished" | "stopped"> {
  if (tasks.length === 0) return "finished";
  let next = 0;
  let pending = 0;
  const workers = new Set<Worker>();
  return new Promise((resolve) => {
    let settled = false;
    const settle = (how: "finished" | "stopped") => {
      if (settled) return;
      settled = true;
      for (const worker of workers) void worker.terminate();
      resolve(how);
    };
    const feed = (worker: Worker, current: { task: WorkerTask | null }) => {
      if (signal.aborted) return settle("stopped");
      if (next >= tasks.length) {
        current.task = null;
        if (pending === 0) settle("finished");
        return;
      }
      current.task = tasks[next++];
      pending++;
      worker.postMessage(current.task);
    };
    const start = () => {
      const worker = new Worker(WORKER_SCRIPT);
      workers.add(worker);
      const current: { task: WorkerTask | null } = { task: null };
      worker.postMessage(setup);
      worker.on("message", (reply: WorkerReply) => {
        if (settled) return; // a stopped run writes nothing more
        pending--;
        current.task = null;
        onReply(reply);
        feed(worker, current);
      });
      worker.on("error", (error) => {
        workers.delete(worker);
        if (settled) return;
        const task = current.task;
        if (task) {
          pending--;
          onReply(onCrash(task, error.message));
        }
        start();
      });
      feed(worker, current);
    };
    signal.addEventListener("abort", () => settle("stopped"), { once: true });
    for (let i = 0; i < Math.min(size, tasks.length) && !settled; i++) start();
  });
}

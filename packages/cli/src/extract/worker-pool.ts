import { Worker } from "node:worker_threads";
import type { WorkProgress } from "@cliquescape/core";
import type { WorkerProgress, WorkerReply, WorkerSetup, WorkerTask } from "./worker-messages.js";

/** The compiled worker script next to this file in dist/. */
const WORKER_SCRIPT = new URL("./graph-worker.js", import.meta.url);

export interface PoolOptions<Task = WorkerTask, Reply = WorkerReply, Setup = WorkerSetup> {
  size: number;
  setup: Setup;
  /** Interrupts the run: no new task starts and the tasks in flight are abandoned at once. */
  signal: AbortSignal;
  /**
   * The per-graph time limit, which the core enforces itself with a message saying how far it got. A task
   * still running well past it (code that cannot check the clock) has its worker terminated and replaced.
   */
  timeLimitSeconds: number | null;
  /** Progress of task `index` while it runs. */
  onProgress?: (index: number, progress: WorkProgress) => void;
  /** The reply standing for a task whose worker died or ran out of time. */
  failedReply: (task: Task, message: string) => Reply;
}

/**
 * Runs tasks on worker threads, one task per worker at a time, handing each reply to `onReply` in the order
 * replies arrive (the caller puts results in dataset order). A worker that dies (a crash, its heap limit)
 * or overruns the time limit answers its task with a failure and is replaced, so one pathological graph
 * cannot end or stall the run.
 */
export function runOnWorkers(
  tasks: readonly WorkerTask[],
  onReply: (reply: WorkerReply) => void,
  options: PoolOptions,
): Promise<"finished" | "stopped"> {
  return runOnWorkerScript(WORKER_SCRIPT, tasks, onReply, options);
}

/** The same pool for another worker script and its own task, reply and setup messages (`connect`). */
export async function runOnWorkerScript<Task, Reply extends { kind: string }, Setup>(
  script: URL,
  tasks: readonly Task[],
  onReply: (reply: Reply) => void,
  options: PoolOptions<Task, Reply, Setup>,
): Promise<"finished" | "stopped"> {
  const { signal, setup, failedReply, timeLimitSeconds } = options;
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
    const start = () => {
      const worker = new Worker(script);
      workers.add(worker);
      let task: Task | null = null;
      let timer: NodeJS.Timeout | undefined;
      const feed = () => {
        if (signal.aborted) return settle("stopped");
        if (next >= tasks.length) {
          if (pending === 0) settle("finished");
          return;
        }
        task = tasks[next++];
        pending++;
        worker.postMessage(task);
        // Unreferenced: a finished or stopped run does not wait for the timer of an abandoned task.
        if (timeLimitSeconds !== null) timer = setTimeout(overrun, hardLimitMs(timeLimitSeconds)).unref();
      };
      // The worker is lost: its task fails with `message`, and a fresh worker takes its place.
      const lose = (message: string) => {
        clearTimeout(timer);
        workers.delete(worker);
        if (settled) return;
        if (task) {
          pending--;
          onReply(failedReply(task, message));
          task = null;
        }
        start();
      };
      const overrun = () => {
        void worker.terminate();
        lose(
          `still running ${Math.round(hardLimitMs(timeLimitSeconds as number) / 1000)} s after it started, past the time limit of ${timeLimitSeconds} s; the graph was abandoned (raise --time-limit, 0: no limit)`,
        );
      };
      worker.postMessage(setup);
      worker.on("message", (reply: Reply | WorkerProgress) => {
        if (settled) return; // a stopped run writes nothing more
        if (isProgress(reply)) {
          options.onProgress?.(reply.index, reply.progress);
          return;
        }
        clearTimeout(timer);
        pending--;
        task = null;
        onReply(reply);
        feed();
      });
      worker.on("error", (error) => lose(`worker stopped: ${error.message}`));
      feed();
    };
    signal.addEventListener("abort", () => settle("stopped"), { once: true });
    for (let i = 0; i < Math.min(options.size, tasks.length) && !settled; i++) start();
  });
}

/** When a task past its time limit is given up: the limit plus a tenth, and at least 30 s more. */
function hardLimitMs(timeLimitSeconds: number): number {
  return (timeLimitSeconds + Math.max(30, timeLimitSeconds / 10)) * 1000;
}

function isProgress(message: { kind: string }): message is WorkerProgress {
  return message.kind === "progress";
}

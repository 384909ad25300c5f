import { Worker } from "node:worker_threads";
import type { WorkProgress } from "@cliquescape/core";
import type { WorkerBatch, WorkerProgress } from "./pool-messages.js";

/** Most tasks one message carries: enough that a million tiny graphs are not a million round trips. */
const MAX_BATCH = 256;

export interface PoolOptions<Task, Reply, Setup> {
  size: number;
  setup: Setup;
  /** Interrupts the run: no new task starts and the tasks in flight are abandoned at once. */
  signal: AbortSignal;
  /**
   * The per-task time limit, which the core enforces itself with a message saying how far it got. A task
   * still running well past it (code that cannot check the clock) has its worker terminated and replaced.
   */
  timeLimitSeconds: number | null;
  /** Progress of task `index` while it runs. */
  onProgress?: (index: number, progress: WorkProgress) => void;
  /** The reply standing for a task whose worker died or ran out of time. */
  failedReply: (task: Task, message: string) => Reply;
}

/**
 * Runs tasks on worker threads running `script` (whose side is serveBatches) and hands each reply to
 * `onReply` in the order replies arrive (the caller puts results in dataset order). Tasks go out in
 * batches, sized so that each worker gets several before the end and the last ones go singly, to even out
 * the finish; answers come back at least every few tens of milliseconds. A worker that dies (a crash, its
 * heap limit, an exit) is replaced and the unanswered tasks of its batch are run again one by one, so the
 * one that killed it fails alone; so is a worker whose task runs well past the time limit. One
 * pathological graph cannot end or stall the run.
 */
export async function runOnWorkerScript<Task, Reply extends { kind: string }, Setup>(
  script: URL,
  tasks: readonly Task[],
  onReply: (reply: Reply) => void,
  options: PoolOptions<Task, Reply, Setup>,
): Promise<"finished" | "stopped"> {
  const { signal, setup, failedReply, timeLimitSeconds } = options;
  if (tasks.length === 0) return "finished";
  let next = 0;
  // Tasks whose worker died under them, waiting to be run alone.
  const alone: Task[] = [];
  let unanswered = tasks.length;
  const workers = new Set<Worker>();
  return new Promise((resolve) => {
    let settled = false;
    const settle = (how: "finished" | "stopped") => {
      if (settled) return;
      settled = true;
      for (const worker of workers) void worker.terminate();
      resolve(how);
    };
    const takeBatch = (): Task[] => {
      const retry = alone.shift();
      if (retry !== undefined) return [retry];
      const size = Math.max(1, Math.min(MAX_BATCH, Math.floor((tasks.length - next) / (8 * options.size))));
      const batch = tasks.slice(next, next + size);
      next += batch.length;
      return batch;
    };
    const start = () => {
      const worker = new Worker(script);
      workers.add(worker);
      // The batch being worked on; the first `answered` of it are done.
      let inFlight: Task[] = [];
      let answered = 0;
      let ranAlone = false;
      let timer: NodeJS.Timeout | undefined;
      // Restarted at each answer: it measures the task now running. Unreferenced: a finished or stopped
      // run does not wait for the timer of an abandoned task.
      const arm = () => {
        clearTimeout(timer);
        if (timeLimitSeconds !== null) timer = setTimeout(overrun, hardLimitMs(timeLimitSeconds)).unref();
      };
      const feed = () => {
        if (signal.aborted) return settle("stopped");
        if (unanswered === 0) return settle("finished");
        ranAlone = alone.length > 0;
        inFlight = takeBatch();
        answered = 0;
        if (inFlight.length === 0) return; // the other workers finish the last batches
        worker.postMessage({ kind: "batch", tasks: inFlight } satisfies WorkerBatch<Task>);
        arm();
      };
      const answer = (reply: Reply) => {
        answered++;
        unanswered--;
        onReply(reply);
      };
      // The worker is lost. The task it was on fails with `message` when that task is known (it ran alone, or
      // was the last unanswered of its batch); otherwise every unanswered task of the batch goes back to run
      // alone, where the one at fault fails again and is named. A fresh worker takes its place.
      let lost = false;
      const lose = (message: string) => {
        if (lost) return; // an error is followed by an exit; a terminated worker exits too
        lost = true;
        clearTimeout(timer);
        workers.delete(worker);
        if (settled) return;
        const left = inFlight.slice(answered);
        inFlight = [];
        if (left.length > 0 && (ranAlone || left.length === 1)) {
          answer(failedReply(left[0], message));
          left.shift();
        }
        for (const task of left) alone.push(task);
        start();
      };
      const overrun = () => {
        void worker.terminate();
        lose(
          `still running ${Math.round(hardLimitMs(timeLimitSeconds as number) / 1000)} s after it started, past the time limit of ${timeLimitSeconds} s; the graph was abandoned (raise --time-limit, 0: no limit)`,
        );
      };
      worker.postMessage(setup);
      worker.on("message", (message: Reply[] | WorkerProgress) => {
        if (settled) return; // a stopped run writes nothing more
        if (!Array.isArray(message)) {
          options.onProgress?.(message.index, message.progress);
          return;
        }
        for (const reply of message) answer(reply);
        if (answered < inFlight.length) return arm();
        clearTimeout(timer);
        feed();
      });
      worker.on("error", (error) => lose(`worker stopped: ${error.message}`));
      // A worker can also end with no error (process.exit in its code): without this the run would wait
      // for its answers for ever.
      worker.on("exit", (code) => lose(`worker exited with code ${code}`));
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

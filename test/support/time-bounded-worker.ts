/**
 * Runs tasks one at a time on a worker thread, each under a hard time bound: a task that does not answer
 * in time has its worker terminated (a synchronous loop cannot be interrupted any other way) and is
 * reported as timed out; a fresh worker takes the remaining tasks. So a hang fails a test instead of
 * stalling the run.
 */
import { Worker } from "node:worker_threads";

export type BoundedOutcome<R> =
  | { index: number; status: "done"; result: R; ms: number }
  | { index: number; status: "error"; message: string; ms: number }
  | { index: number; status: "timeout"; ms: number };

export async function runTimeBounded<T extends { index: number }, R>(
  script: URL,
  workerData: unknown,
  tasks: readonly T[],
  limitMs: number,
): Promise<BoundedOutcome<R>[]> {
  const outcomes: BoundedOutcome<R>[] = [];
  let next = 0;
  while (next < tasks.length) {
    const worker = new Worker(script, { workerData });
    try {
      await readyOf(worker);
      for (; next < tasks.length; next++) {
        const task = tasks[next];
        const started = Date.now();
        const reply = await answerOf(worker, task, limitMs);
        const ms = Date.now() - started;
        if (reply === null) {
          outcomes.push({ index: task.index, status: "timeout", ms });
          next++;
          break; // the worker is stuck: terminate it and go on with a new one
        }
        if ("error" in reply) outcomes.push({ index: task.index, status: "error", message: reply.error, ms });
        else outcomes.push({ index: task.index, status: "done", result: reply.result as R, ms });
      }
    } finally {
      await worker.terminate();
    }
  }
  return outcomes;
}

type Reply = { index: number; result: unknown } | { index: number; error: string };

function readyOf(worker: Worker): Promise<void> {
  return new Promise((resolve, reject) => {
    worker.once("message", () => resolve());
    worker.once("error", reject);
  });
}

function answerOf(worker: Worker, task: { index: number }, limitMs: number): Promise<Reply | null> {
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => {
      worker.off("message", onMessage);
      worker.off("error", onError);
      resolve(null);
    }, limitMs);
    const onMessage = (reply: Reply) => {
      if (reply.index !== task.index) return;
      clearTimeout(timer);
      worker.off("error", onError);
      worker.off("message", onMessage);
      resolve(reply);
    };
    const onError = (error: Error) => {
      clearTimeout(timer);
      worker.off("message", onMessage);
      reject(error);
    };
    worker.on("message", onMessage);
    worker.once("error", onError);
    worker.postMessage(task);
  });
}

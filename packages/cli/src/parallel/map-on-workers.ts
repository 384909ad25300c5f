import type { MessagePort } from "node:worker_threads";
import { serveBatches } from "./serve-batches.js";
import { runOnWorkerScript } from "./worker-pool.js";

/** What a worker of mapOnWorkers answers for one task: the reply, or the error the task threw. */
type TaskAnswer<Reply> =
  | { kind: "reply"; reply: Reply; transfer: ArrayBuffer[] }
  | { kind: "error"; name: string; message: string; transfer: ArrayBuffer[] };

interface TaskSetup<Setup> {
  kind: "setup";
  setup: Setup;
}

/**
 * Runs tasks on `size` worker threads running `script` (whose side is serveTasks), on the pool of
 * worker-pool.ts: each worker gets `setup` once; each reply goes to `onReply` as it arrives. An error a task
 * throws stops the run and is thrown here (the tasks are pure computations on data already checked: a
 * failure is a bug or a budget, not a file); a worker that dies is replaced, and the task that killed it
 * fails the run with what became of the worker.
 */
export async function mapOnWorkers<Task, Reply>(
  script: URL,
  setup: unknown,
  tasks: readonly Task[],
  size: number,
  onReply: (reply: Reply) => void,
): Promise<void> {
  const stop = new AbortController();
  let failure: Error | null = null;
  await runOnWorkerScript<Task, TaskAnswer<Reply>, TaskSetup<unknown>>(
    script,
    tasks,
    (answer) => {
      if (failure !== null) return;
      if (answer.kind === "reply") {
        onReply(answer.reply);
        return;
      }
      failure = new Error(answer.message);
      failure.name = answer.name;
      stop.abort();
    },
    {
      size,
      setup: { kind: "setup", setup },
      signal: stop.signal,
      timeLimitSeconds: null,
      failedReply: (_task, message) => ({ kind: "error", name: "Error", message, transfer: [] }),
    },
  );
  if (failure !== null) throw failure;
}

/** The worker side: answers each task with `handle(setup, task)`, errors passed back by name and message. */
export function serveTasks<Setup, Task, Reply>(
  port: MessagePort | null,
  handle: (setup: Setup, task: Task) => { reply: Reply; transfer?: ArrayBuffer[] },
): void {
  if (!port) throw new Error("this script runs as a worker thread");
  let setup: Setup | undefined;
  serveBatches<TaskSetup<Setup>, Task, TaskAnswer<Reply>>(port, {
    setup(message) {
      setup = message.setup;
    },
    handle(task) {
      try {
        const { reply, transfer } = handle(setup as Setup, task);
        return { kind: "reply", reply, transfer: transfer ?? [] };
      } catch (error) {
        const e = error instanceof Error ? error : new Error(String(error));
        return { kind: "error", name: e.name, message: e.message, transfer: [] };
      }
    },
    transfer: (answer) => answer.transfer,
  });
}

import { Worker } from "node:worker_threads";

/**
 * Runs numbered tasks on `size` worker threads running `script`: each worker gets `setup` once, then one
 * task at a time; each reply goes to `onReply` as it arrives. A worker error rejects the whole run (the
 * tasks here are pure computations on data already checked: a failure is a bug or a budget, not a file).
 */
export async function mapOnWorkers<Task, Reply>(
  script: URL,
  setup: unknown,
  tasks: readonly Task[],
  size: number,
  onReply: (reply: Reply) => void,
): Promise<void> {
  if (tasks.length === 0) return;
  let next = 0;
  let running = 0;
  const workers: Worker[] = [];
  try {
    await new Promise<void>((resolve, reject) => {
      const start = () => {
        const worker = new Worker(script);
        workers.push(worker);
        const feed = () => {
          if (next >= tasks.length) {
            if (running === 0) resolve();
            return;
          }
          running++;
          worker.postMessage({ task: tasks[next++] });
        };
        worker.on("message", (message: { reply?: Reply; error?: { name: string; message: string } }) => {
          running--;
          if (message.error) {
            const error = new Error(message.error.message);
            error.name = message.error.name;
            reject(error);
            return;
          }
          onReply(message.reply as Reply);
          feed();
        });
        worker.on("error", reject);
        worker.postMessage({ setup });
        feed();
      };
      for (let i = 0; i < Math.max(1, Math.min(size, tasks.length)); i++) start();
    });
  } finally {
    await Promise.all(workers.map((w) => w.terminate()));
  }
}

/** The worker side: answers each task with `handle(setup, task)`, errors passed back by name and message. */
export function serveTasks<Setup, Task, Reply>(
  port: import("node:worker_threads").MessagePort | null,
  handle: (setup: Setup, task: Task) => { reply: Reply; transfer?: ArrayBuffer[] },
): void {
  if (!port) throw new Error("this script runs as a worker thread");
  let setup: Setup | undefined;
  port.on("message", (message: { setup?: Setup; task?: Task }) => {
    if (message.setup !== undefined) {
      setup = message.setup;
      return;
    }
    try {
      const { reply, transfer } = handle(setup as Setup, message.task as Task);
      port.postMessage({ reply }, transfer ?? []);
    } catch (error) {
      const e = error instanceof Error ? error : new Error(String(error));
      port.postMessage({ error: { name: e.name, message: e.message } });
    }
  });
}

import type { MessagePort } from "node:worker_threads";
import type { WorkerBatch } from "./pool-messages.js";

/** Replies wait at most this long to be sent together: one message per tiny graph costs more than the graph. */
const GATHER_MS = 50;

export interface BatchHandlers<Setup, Task, Reply> {
  setup(setup: Setup): void;
  handle(task: Task): Reply;
  /** Buffers to move to the main thread rather than copy. */
  transfer(reply: Reply): ArrayBuffer[];
}

/**
 * The worker side of the pool's protocol (worker-pool.ts): a setup message, then batches of tasks done in
 * order, answered with arrays of replies at least every GATHER_MS (a long task answers on its own). Returns
 * `flush`, which sends the replies held so far: call it before any other message (progress of a long task),
 * so the pool always knows which tasks are done.
 */
export function serveBatches<Setup extends { kind: "setup" }, Task, Reply>(
  port: MessagePort,
  handlers: BatchHandlers<Setup, Task, Reply>,
): { flush: () => void } {
  let held: Reply[] = [];
  let since = 0;
  const flush = () => {
    if (held.length === 0) return;
    const transfer: ArrayBuffer[] = [];
    for (const reply of held) transfer.push(...handlers.transfer(reply));
    port.postMessage(held, transfer);
    held = [];
  };
  port.on("message", (message: Setup | WorkerBatch<Task>) => {
    if (message.kind === "setup") {
      handlers.setup(message as Setup);
      return;
    }
    for (const task of (message as WorkerBatch<Task>).tasks) {
      if (held.length > 0 && Date.now() - since >= GATHER_MS) flush();
      if (held.length === 0) since = Date.now();
      held.push(handlers.handle(task));
    }
    flush();
  });
  return { flush };
}

import { parentPort } from "node:worker_threads";
import type { WorkControl } from "@cliquescape/core";
import { edgeValues } from "./edge-values.js";
import { graphFailureOf } from "./graph-failure.js";
import { computeGraph } from "./graph-job.js";
import { readPreparedGraph } from "./read-prepared-graph.js";
import { strideSample } from "./weight-quantiles.js";
import type { WorkerProgress, WorkerReply, WorkerSetup, WorkerTask } from "./worker-messages.js";

/*
 * Worker thread entry: computes one graph per message and posts the result back. It writes no files: the
 * main thread writes every output, so an interrupted run never leaves a file half-written by a worker.
 */

if (!parentPort) throw new Error("graph-worker.js runs as a worker thread");
const port = parentPort;
let setup: WorkerSetup | null = null;

port.on("message", (message: WorkerSetup | WorkerTask) => {
  if (message.kind === "setup") {
    setup = message;
    return;
  }
  const reply = handle(message);
  const transfer: ArrayBuffer[] = [];
  if (reply.kind === "sample" && reply.values) transfer.push(reply.values.buffer as ArrayBuffer);
  if (reply.kind === "extract" && reply.outcome.ok) {
    transfer.push(reply.outcome.values.buffer as ArrayBuffer);
    if (reply.outcome.bundle) transfer.push(reply.outcome.bundle.buffer as ArrayBuffer);
  }
  port.postMessage(reply, transfer);
});

function handle(task: WorkerTask): WorkerReply {
  if (!setup) throw new Error("a worker got a task before its setup");
  if (task.kind === "extract") {
    if (!setup.spec) throw new Error("an extract task before the grid was fixed");
    const limit = setup.spec.complex.timeLimitSeconds;
    const index = task.index;
    const work: WorkControl = {
      startedAt: Date.now(),
      ...(limit === null ? {} : { timeLimitMs: limit * 1000 }),
      onProgress: (progress) =>
        port.postMessage({ kind: "progress", index, progress } satisfies WorkerProgress),
    };
    return {
      kind: "extract",
      index,
      outcome: computeGraph(task.entry, task.relativeFile, task.labelCode, setup.spec, work),
    };
  }
  try {
    const { graph } = readPreparedGraph(task.entry, setup.preparation, setup.connectivity);
    const values = Float64Array.from(strideSample(edgeValues(graph), task.limit));
    return { kind: "sample", index: task.index, values, failure: null };
  } catch (error) {
    return {
      kind: "sample",
      index: task.index,
      values: null,
      failure: graphFailureOf(error, task.entry.file),
    };
  }
}

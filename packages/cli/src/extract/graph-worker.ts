import { parentPort } from "node:worker_threads";
import { edgeCount, type WorkControl } from "@cliquescape/core";
import type { WorkerProgress } from "../parallel/pool-messages.js";
import { serveBatches } from "../parallel/serve-batches.js";
import { edgeValues } from "./edge-values.js";
import { graphFailureOf } from "./graph-failure.js";
import { computeGraph } from "./graph-job.js";
import { readPreparedGraph } from "./read-prepared-graph.js";
import { strideSample } from "./weight-quantiles.js";
import type { WorkerReply, WorkerSetup, WorkerTask } from "./worker-messages.js";

/*
 * Worker thread entry: computes the graphs of each batch in order and posts the results back. It writes no
 * files: the main thread writes every output, so an interrupted run never leaves a file half-written by a
 * worker.
 */

if (!parentPort) throw new Error("graph-worker.js runs as a worker thread");
const port = parentPort;
let setup: WorkerSetup | null = null;

const { flush } = serveBatches<WorkerSetup, WorkerTask, WorkerReply>(port, {
  setup: (message) => {
    setup = message;
  },
  handle,
  transfer: (reply) => {
    if (reply.kind === "sample") return reply.values ? [reply.values.buffer as ArrayBuffer] : [];
    if (!reply.outcome.ok) return [];
    const buffers = [reply.outcome.values.buffer as ArrayBuffer];
    if (reply.outcome.bundle) buffers.push(reply.outcome.bundle.buffer as ArrayBuffer);
    return buffers;
  },
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
      // Replies held back go first: the pool then knows this graph is the one running.
      onProgress: (progress) => {
        flush();
        port.postMessage({ kind: "progress", index, progress } satisfies WorkerProgress);
      },
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
    const size = { nodes: graph.n, edges: edgeCount(graph), directed: graph.directed };
    return { kind: "sample", index: task.index, values, size, failure: null };
  } catch (error) {
    return {
      kind: "sample",
      index: task.index,
      values: null,
      size: null,
      failure: graphFailureOf(error, task.entry.file),
    };
  }
}

import { parentPort } from "node:worker_threads";
import { readDatasetConnectivity } from "@cliquescape/io";
import { graphFailureOf } from "../extract/graph-failure.js";
import { serveBatches } from "../parallel/serve-batches.js";
import type { ConnectReply, ConnectSetup, ConnectTask } from "./connect-messages.js";
import { measureOptions, recordingOptions } from "./connectivity-spec.js";

/*
 * Worker thread entry of `connect`: reads the recordings of each batch and posts their connectivity
 * matrices back (transferred, not copied). It writes no files: the main thread writes every output in order.
 */

const port = parentPort;
if (!port) throw new Error("connect-worker.js runs as a worker thread");
let setup: ConnectSetup | null = null;

serveBatches<ConnectSetup, ConnectTask, ConnectReply>(port, {
  setup: (message) => {
    setup = message;
  },
  handle: measure,
  transfer: (reply) => (reply.ok ? [reply.values.buffer as ArrayBuffer] : []),
});

function measure(task: ConnectTask): ConnectReply {
  if (!setup) throw new Error("a worker got a task before its setup");
  try {
    const {
      connectivity: c,
      timePoints,
      warnings,
    } = readDatasetConnectivity(
      task.entry,
      recordingOptions(setup.connectivity),
      measureOptions(setup.connectivity),
    );
    return {
      kind: "connect",
      index: task.index,
      ok: true,
      n: c.n,
      values: c.values,
      labels: c.labels ? [...c.labels] : null,
      timePoints,
      isolated: c.isolated,
      shrinkage: c.shrinkage ?? null,
      warnings,
    };
  } catch (error) {
    return {
      kind: "connect",
      index: task.index,
      ok: false,
      failure: graphFailureOf(error, task.entry.file),
      warnings: [],
    };
  }
}

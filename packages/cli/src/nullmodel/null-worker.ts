import { parentPort } from "node:worker_threads";
import {
  type NullFeatureOptions,
  type NullSampleOptions,
  nullSampleBlock,
  type WeightedGraph,
} from "@cliquescape/core";
import { serveTasks } from "../parallel/map-on-workers.js";

/** Sent once: the observed graph and how to sample and measure. */
export interface NullSetup {
  graph: WeightedGraph;
  sampling: NullSampleOptions;
  features: NullFeatureOptions;
}

/** Samples from..to−1. */
export interface NullTask {
  from: number;
  to: number;
}

export interface NullReply {
  from: number;
  /** Row-major (to − from) × features. */
  values: Float64Array;
  swaps: number;
  refused: number;
}

/** Draws and measures a block of null samples; also used in the main thread when one worker is enough. */
export function nullBlock(setup: NullSetup, task: NullTask): NullReply {
  const block = nullSampleBlock(setup.graph, task.from, task.to, setup.sampling, setup.features);
  return { from: task.from, ...block };
}

if (parentPort) {
  serveTasks<NullSetup, NullTask, NullReply>(parentPort, (setup, task) => {
    const reply = nullBlock(setup, task);
    return { reply, transfer: [reply.values.buffer as ArrayBuffer] };
  });
}

import { parentPort } from "node:worker_threads";
import {
  type NullFeatureOptions,
  type NullSampleOptions,
  nullFeatures,
  nullSample,
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
  const rows: Float64Array[] = [];
  let swaps = 0;
  let refused = 0;
  for (let s = task.from; s < task.to; s++) {
    const sample = nullSample(setup.graph, s, setup.sampling);
    swaps += sample.swaps;
    refused += sample.refused;
    rows.push(nullFeatures(sample.graph, setup.features));
  }
  const width = rows[0]?.length ?? 0;
  const values = new Float64Array(rows.length * width);
  for (let i = 0; i < rows.length; i++) values.set(rows[i], i * width);
  return { from: task.from, values, swaps, refused };
}

if (parentPort) {
  serveTasks<NullSetup, NullTask, NullReply>(parentPort, (setup, task) => {
    const reply = nullBlock(setup, task);
    return { reply, transfer: [reply.values.buffer as ArrayBuffer] };
  });
}

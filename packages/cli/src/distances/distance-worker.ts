import { parentPort } from "node:worker_threads";
import { bottleneckDistance, type PersistenceDiagram, wassersteinDistance } from "@cliquescape/core";
import { serveTasks } from "../parallel/map-on-workers.js";

/** Sent once: every diagram and the metric (p = null: bottleneck). */
export interface DistanceSetup {
  diagrams: PersistenceDiagram[];
  p: number | null;
}

/** One row of the upper triangle: distances from diagram `row` to every later one. */
export interface DistanceTask {
  row: number;
}

export interface DistanceReply {
  row: number;
  values: Float64Array;
}

export function distanceRow(setup: DistanceSetup, task: DistanceTask): DistanceReply {
  const { diagrams, p } = setup;
  const a = diagrams[task.row];
  const values = new Float64Array(diagrams.length - task.row - 1);
  for (let j = task.row + 1; j < diagrams.length; j++)
    values[j - task.row - 1] =
      p === null ? bottleneckDistance(a, diagrams[j]) : wassersteinDistance(a, diagrams[j], p);
  return { row: task.row, values };
}

if (parentPort) {
  serveTasks<DistanceSetup, DistanceTask, DistanceReply>(parentPort, (setup, task) => {
    const reply = distanceRow(setup, task);
    return { reply, transfer: [reply.values.buffer as ArrayBuffer] };
  });
}

import type { DatasetEntry } from "@cliquescape/io";
import type { GraphFailure } from "./graph-failure.js";
import type { GraphOutcome } from "./graph-job.js";
import type { ResolvedRunSpec, RunSpec } from "./run-spec.js";

/** Nodes and edges (arcs when directed) of a prepared graph. */
export interface GraphSize {
  nodes: number;
  edges: number;
  directed: boolean;
}

/** Sent once to each worker before any task: the settings every graph is computed with. */
export interface WorkerSetup {
  kind: "setup";
  preparation: RunSpec["preparation"];
  /** For recordings: how each becomes a matrix (the first pass reads them before `spec` exists). */
  connectivity?: RunSpec["connectivity"];
  /** Null during the first pass, before the grid is fixed. */
  spec: ResolvedRunSpec | null;
}

/** What the main thread asks of a worker: one graph at a time. */
export type WorkerTask =
  | { kind: "sample"; index: number; entry: DatasetEntry; limit: number }
  | { kind: "extract"; index: number; entry: DatasetEntry; relativeFile: string; labelCode: number };

/** A worker's answer to one task, tagged with the task's index. */
export type WorkerReply =
  | {
      kind: "sample";
      index: number;
      values: Float64Array | null;
      /** The prepared graph's size (what a shard plan estimates its cost from); null when it failed. */
      size: GraphSize | null;
      failure: GraphFailure | null;
    }
  | { kind: "extract"; index: number; outcome: GraphOutcome };

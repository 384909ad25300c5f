import type { DatasetEntry } from "@cliquescape/io";
import type { GraphFailure } from "../extract/graph-failure.js";
import type { ConnectivitySpec } from "./connectivity-spec.js";

/** Sent once to each worker: how every recording is read and measured. */
export interface ConnectSetup {
  kind: "setup";
  connectivity: ConnectivitySpec;
}

/** One recording to turn into a matrix. */
export interface ConnectTask {
  kind: "connect";
  index: number;
  entry: DatasetEntry;
}

/** A recording's matrix and what was noted about it, or why it has none. */
export type ConnectReply =
  | {
      kind: "connect";
      index: number;
      ok: true;
      /** Channels: the matrix is n × n, row-major, diagonal 0, never NaN. */
      n: number;
      values: Float64Array;
      labels: string[] | null;
      timePoints: number;
      isolated: number[];
      /** partial: the Ledoit–Wolf shrinkage weight. */
      shrinkage: number | null;
      warnings: string[];
    }
  | { kind: "connect"; index: number; ok: false; failure: GraphFailure; warnings: string[] };

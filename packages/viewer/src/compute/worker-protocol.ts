import type { GraphBytesOptions, GraphJson } from "@cliquescape/io/browser";
import type { AnalysisSettings, GraphAnalysis } from "./graph-analysis.js";

/** How a dropped file is read: the reader options a person can choose on the page. */
export type DropReadOptions = Pick<GraphBytesOptions, "directed" | "semantics" | "negative" | "symmetrize">;

/** Messages from the page to the analysis worker. */
export type WorkerRequest =
  | { kind: "open-json"; json: GraphJson; source: string; settings: AnalysisSettings }
  | { kind: "open-bytes"; name: string; bytes: Uint8Array; read: DropReadOptions; settings: AnalysisSettings }
  | { kind: "loop"; bar: number }
  | { kind: "participation"; threshold: number };

/** A graph opened and analysed. */
export interface OpenedGraph {
  analysis: GraphAnalysis;
  /** Node positions from the data (x, y per node), or null: the page then lays the graph out. */
  coordinates: Float64Array | null;
  warnings: string[];
}

/** An error as the page shows it: the reader's message, with its position when the input had one. */
export interface WorkerError {
  name: string;
  message: string;
  problem?: string;
  file?: string;
  line?: number;
  column?: number;
}

export type WorkerResult = OpenedGraph | Int32Array | Float64Array;

export type WorkerReply =
  | { id: number; ok: true; result: WorkerResult }
  | { id: number; ok: false; error: WorkerError };

import type { WorkProgress } from "@cliquescape/core";
import type { DatasetEntry } from "@cliquescape/io";
import { progressLine } from "../work-progress.js";
import { labelCoder } from "./assemble-tables.js";
import { runOnWorkers } from "./graph-pool.js";
import { type GraphRecord, readRecord } from "./graph-record.js";
import { startProgress } from "./progress.js";
import { graphPaths, type RunFolder } from "./run-folder.js";
import type { ResolvedRunSpec } from "./run-spec.js";
import { outputsIntact, saveGraph } from "./save-graph.js";

export interface ComputeRequest {
  /** Where the per-graph files go: the run folder, or a shard's part of it. */
  folder: RunFolder;
  entries: readonly DatasetEntry[];
  /** Dataset positions to compute (all of them, or a shard's share). */
  positions: readonly number[];
  /** Input file hashes by dataset position (only `positions` are read). */
  hashes: readonly string[];
  spec: ResolvedRunSpec;
  fingerprint: string;
  relativeFile: (file: string) => string;
  workers: number;
  signal: AbortSignal;
  /** Counts the graphs saved (before or now), for the message when a write fails. */
  kept?: { graphs: number };
}

export interface ComputeResult {
  /** Records of the graphs done (before or now), by id. */
  records: Map<string, GraphRecord>;
  /** Graphs whose valid record was already there. */
  skipped: number;
  /** Whether the work was stopped (interrupt) before every graph was done. */
  stopped: boolean;
}

/**
 * Computes the graphs at `positions` that have no valid record in `folder` (same input bytes, same settings,
 * outputs whole) on worker threads, writing each graph's files as it finishes.
 */
export async function computeGraphs(request: ComputeRequest): Promise<ComputeResult> {
  const { folder, entries, hashes, spec, fingerprint, relativeFile } = request;
  const records = new Map<string, GraphRecord>();
  const todo: number[] = [];
  for (const i of request.positions) {
    const entry = entries[i];
    const record = readRecord(graphPaths(folder, entry.id).record);
    if (
      record?.ok &&
      record.sha256 === hashes[i] &&
      record.settings === fingerprint &&
      outputsIntact(folder, record, spec)
    )
      records.set(entry.id, record);
    else todo.push(i);
  }
  const skipped = records.size;
  if (request.kept) request.kept.graphs = skipped;

  let failed = 0;
  const progress = startProgress("graphs", todo.length);
  // What each graph in flight is doing; the longest-running one is shown once it has run a while.
  const inFlight = new Map<number, WorkProgress>();
  const working = (): string | undefined => {
    let slowest: [number, WorkProgress] | null = null;
    for (const entry of inFlight) if (!slowest || entry[1].elapsedMs > slowest[1].elapsedMs) slowest = entry;
    if (!slowest || slowest[1].elapsedMs < 2000) return undefined;
    return `${entries[slowest[0]].id}: ${progressLine(slowest[1])}`;
  };
  const codeOf = labelCoder(spec.labelNames);
  const tasks = todo.map((i) => ({
    kind: "extract" as const,
    index: i,
    entry: entries[i],
    relativeFile: relativeFile(entries[i].file),
    labelCode: codeOf(entries[i].label),
  }));
  // A graph's files that cannot be written stop the run (the disk is full, or read-only): every graph
  // saved before stays, and the tables keep their previous whole set.
  let writeFailure: unknown = null;
  const stopOnFailure = new AbortController();
  const ended = await runOnWorkers(
    tasks,
    (reply) => {
      if (reply.kind !== "extract") return;
      inFlight.delete(reply.index);
      const entry = entries[reply.index];
      if (writeFailure !== null) return;
      let record: GraphRecord;
      try {
        record = saveGraph(folder, entry, reply.outcome, hashes[reply.index], fingerprint, relativeFile);
      } catch (error) {
        // Thrown here it would escape the worker's message handler: stop the run and report it below.
        writeFailure = error;
        stopOnFailure.abort();
        return;
      }
      records.set(entry.id, record);
      if (request.kept) request.kept.graphs++;
      if (!record.ok) failed++;
      progress.update(records.size - skipped, failed, working());
    },
    {
      size: Math.max(1, Math.min(request.workers, todo.length)),
      setup: { kind: "setup", preparation: spec.preparation, spec },
      signal: AbortSignal.any([request.signal, stopOnFailure.signal]),
      timeLimitSeconds: spec.complex.timeLimitSeconds,
      onProgress: (index, p) => {
        inFlight.set(index, p);
        progress.update(records.size - skipped, failed, working());
      },
      failedReply: (task, message) => ({
        kind: "extract",
        index: task.index,
        outcome: {
          ok: false,
          warnings: [],
          failure: { file: task.entry.file, line: null, column: null, reason: message, kind: "WorkerError" },
        },
      }),
    },
  );
  progress.stop();
  if (writeFailure !== null) throw writeFailure;
  return { records, skipped, stopped: ended === "stopped" };
}

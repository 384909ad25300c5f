import { existsSync, readFileSync } from "node:fs";
import { dirname, relative, resolve, sep } from "node:path";
import type { WorkProgress } from "@cliquescape/core";
import {
  type Dataset,
  type OpenDatasetOptions,
  openDataset,
  openTimeSeriesDataset,
  writeFileAtomic,
} from "@cliquescape/io";
import { recordingOptions } from "../connect/connectivity-spec.js";
import { UsageError } from "../options/graph-options.js";
import { progressLine } from "../work-progress.js";
import { assembleTables, type ErrorRow, labelCoder, problemRow } from "./assemble-tables.js";
import { checkInputsOutside, checkOutFolder } from "./check-out-folder.js";
import { runFeatureNames } from "./graph-job.js";
import { type GraphRecord, readRecord } from "./graph-record.js";
import { hashInputs, hashOrNote } from "./input-hashes.js";
import { validateSpec } from "./load-spec.js";
import { isOutputIOError, OutputIOError } from "./output-io-error.js";
import { startProgress } from "./progress.js";
import { resolveSpec } from "./resolve-spec.js";
import {
  createRunFolder,
  graphPaths,
  markRunFolder,
  type RunFolder,
  removeLeftoverTemps,
  runFolder,
  unmarkIfEmpty,
} from "./run-folder.js";
import { lockRunFolder, type RunFolderLock } from "./run-folder-lock.js";
import { renderSummary } from "./run-summary.js";
import { outputsIntact, saveGraph } from "./save-graph.js";
import { settingsFingerprint, specDifferences } from "./spec-differences.js";
import { specDocument } from "./spec-document.js";
import { tableSetProblem, writeTableSet } from "./table-set.js";
import { runOnWorkers } from "./worker-pool.js";

export interface ExtractRequest {
  dataset: string;
  out: string;
  workers: number;
  /** The spec as merged from --spec and the options; validated here. */
  spec: Record<string, unknown>;
  specSource: string;
  /** How to open the dataset: labels of a stack, shared node coordinates, the array of a .npz/.mat. */
  datasetOptions?: OpenDatasetOptions;
  /** Interrupts the run (Ctrl-C); finished graphs stay saved and the tables are written from them. */
  signal: AbortSignal;
}

export interface ExtractResult {
  exitCode: number;
  folder: RunFolder;
  graphs: number;
  done: number;
  failed: number;
  skipped: number;
  interrupted: boolean;
}

/**
 * The extract job: fix the spec (first pass if the grid needs one), refuse to mix with a run folder made
 * under other settings, compute every graph not already done on worker threads, write each graph's files
 * as it finishes, then assemble the tables from the per-graph records in dataset order.
 */
export async function runExtract(request: ExtractRequest): Promise<ExtractResult> {
  // Before anything is read or computed: --out is a file, or someone else's folder.
  const { resumed } = checkOutFolder(request.out, request.dataset);
  const folder = runFolder(request.out);
  const existed = existsSync(folder.root);
  const kept = { graphs: 0 };
  // A write the system refuses (full, read-only, no permission) becomes one line naming --out and the path.
  const restated = (error: unknown) =>
    isOutputIOError(error, request.out)
      ? new OutputIOError(
          error,
          request.out,
          kept.graphs > 0
            ? `the ${kept.graphs} graphs finished are kept; run the same command again to finish`
            : "nothing in the folder was lost; run the same command again once it can be written",
        )
      : error;
  let lock: RunFolderLock;
  try {
    markRunFolder(folder);
    // One run per folder at a time: a second one refuses at once, naming the holder.
    lock = lockRunFolder(folder, request.out);
  } catch (error) {
    throw restated(error);
  }
  try {
    const result = await extractInto(folder, request, kept);
    lock.release();
    return result;
  } catch (error) {
    lock.release();
    // A run that stopped before writing anything leaves the folder as it found it.
    if (!resumed) unmarkIfEmpty(folder, existed);
    throw restated(error);
  }
}

/** The run itself, in a folder that is ours and locked; `kept.graphs` counts the graphs saved so far. */
async function extractInto(
  folder: RunFolder,
  request: ExtractRequest,
  kept: { graphs: number },
): Promise<ExtractResult> {
  const requested = validateSpec(request.spec, request.specSource);
  const maxFileMiB = requested.preparation.maxFileMiB;
  const maxBytes = maxFileMiB === null ? {} : { maxBytes: maxFileMiB * 2 ** 20 };
  // Recordings are opened as such: a stack of recordings counts along its subject axis, one file is one entry.
  const dataset = requested.connectivity
    ? openTimeSeriesDataset(request.dataset, {
        ...request.datasetOptions,
        ...maxBytes,
        ...recordingOptions(requested.connectivity),
      })
    : openDataset(request.dataset, { ...request.datasetOptions, ...maxBytes });
  if (dataset.kind === "manifest" && resolve(request.dataset) !== dataset.root) {
    process.stderr.write(
      `cliquescape: ${request.dataset} holds a manifest: reading the dataset from ${dataset.root}\n`,
    );
  }
  // Files are named relative to the dataset's folder, so records and tables do not depend on where it sits.
  const base = dataset.kind === "folder" ? dataset.root : dirname(dataset.root);
  const relativeFile = (file: string) => relative(base, file).split(sep).join("/");
  checkInputsOutside(request.out, base, inputFiles(dataset));
  const previous = existsSync(folder.spec) ? validateSpec(readJson(folder.spec), folder.spec) : null;
  const hashes = hashInputs(dataset.entries.map((entry) => entry.file));

  const problems: ErrorRow[] = dataset.problems.map((p) => problemRow(p, relativeFile(p.file)));
  if (dataset.entries.length === 0) {
    const listed = problems.map((p) => `  ${p.file}${p.line === null ? "" : `:${p.line}`}: ${p.reason}`);
    throw new UsageError(
      `${request.dataset} names no usable graph${listed.length > 0 ? `:\n${listed.join("\n")}` : ""}`,
    );
  }
  const spec = await resolveSpec(requested, previous, dataset, request);
  if (previous) {
    const differences = specDifferences(previous, spec);
    if (differences.length > 0) {
      throw new SpecMismatchError(
        `${folder.root} holds results made under other settings; refusing to mix them:\n` +
          `${differences.map((line) => `  ${line}`).join("\n")}\n` +
          `Use another --out folder, or pass --spec ${folder.spec} to continue with its settings.`,
      );
    }
  }
  const featureNames = runFeatureNames(spec);

  createRunFolder(folder);
  removeLeftoverTemps(folder);
  const unfinished = tableSetProblem(folder);
  if (unfinished !== null)
    process.stderr.write(
      `cliquescape: the tables in ${folder.root} are not a whole set (${unfinished}); they are rewritten from the graphs' records\n`,
    );
  writeFileAtomic(
    folder.spec,
    specDocument(
      spec,
      request.dataset,
      dataset,
      hashes,
      dataset.kind === "manifest" ? hashOrNote(dataset.root) : "",
      relativeFile,
      request.datasetOptions,
    ),
  );

  const fingerprint = settingsFingerprint(spec);
  const records = new Map<string, GraphRecord>();
  const todo: number[] = [];
  dataset.entries.forEach((entry, i) => {
    const record = readRecord(graphPaths(folder, entry.id).record);
    if (
      record?.ok &&
      record.sha256 === hashes[i] &&
      record.settings === fingerprint &&
      outputsIntact(folder, record, spec)
    )
      records.set(entry.id, record);
    else todo.push(i);
  });
  const skipped = records.size;
  kept.graphs = skipped;

  let failed = 0;
  const progress = startProgress("graphs", todo.length);
  // What each graph in flight is doing; the longest-running one is shown once it has run a while.
  const inFlight = new Map<number, WorkProgress>();
  const working = (): string | undefined => {
    let slowest: [number, WorkProgress] | null = null;
    for (const entry of inFlight) if (!slowest || entry[1].elapsedMs > slowest[1].elapsedMs) slowest = entry;
    if (!slowest || slowest[1].elapsedMs < 2000) return undefined;
    return `${dataset.entries[slowest[0]].id}: ${progressLine(slowest[1])}`;
  };
  const codeOf = labelCoder(spec.labelNames);
  const tasks = todo.map((i) => ({
    kind: "extract" as const,
    index: i,
    entry: dataset.entries[i],
    relativeFile: relativeFile(dataset.entries[i].file),
    labelCode: codeOf(dataset.entries[i].label),
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
      const entry = dataset.entries[reply.index];
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
      kept.graphs++;
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

  const tables = assembleTables(dataset.entries, records, featureNames, spec.labelNames, problems);
  writeTableSet(folder, tables);

  const interrupted = ended === "stopped";
  const doneRecords = dataset.entries
    .map((e) => records.get(e.id))
    .filter((r): r is GraphRecord => r !== undefined);
  process.stdout.write(
    renderSummary({
      folder,
      spec,
      featureNames,
      records: doneRecords,
      totalGraphs: dataset.entries.length,
      skipped,
      errors: tables.errors,
      interrupted,
    }),
  );
  const failedGraphs = tables.errors.length;
  return {
    exitCode: interrupted ? 130 : failedGraphs > 0 ? 1 : 0,
    folder,
    graphs: dataset.entries.length,
    done: tables.rows,
    failed: failedGraphs,
    skipped,
    interrupted,
  };
}

/**
 * The run's input files to keep out of --out: the manifest or stack itself and the graph files it names.
 * A folder dataset's graph files lie directly in the dataset's folder, which is compared on its own.
 */
function inputFiles(dataset: Dataset): string[] {
  if (dataset.kind === "folder") return [];
  if (dataset.kind !== "manifest") return [dataset.root];
  const files = new Set<string>([dataset.root]);
  for (const entry of dataset.entries) files.add(entry.file);
  return [...files];
}

/** Raised when an output folder holds results made under different settings. */
export class SpecMismatchError extends UsageError {}

function readJson(path: string): Record<string, unknown> {
  return JSON.parse(readFileSync(path, "utf8")) as Record<string, unknown>;
}

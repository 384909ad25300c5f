import { existsSync, readFileSync } from "node:fs";
import { dirname, relative, sep } from "node:path";
import { checkFeatureAxis } from "@cliquescape/core";
import {
  type Dataset,
  type DatasetEntry,
  graphFeatureNames,
  hashFile,
  type OpenDatasetOptions,
  openDataset,
  writeFileAtomic,
} from "@cliquescape/io";
import { UsageError } from "../options/graph-options.js";
import { VERSION } from "../version.js";
import { assembleTables, type ErrorRow, labelCode, problemRow } from "./assemble-tables.js";
import { featureConfigOf, type GraphOutcome } from "./graph-job.js";
import { encodeRecord, type GraphRecord, readRecord } from "./graph-record.js";
import { validateSpec } from "./load-spec.js";
import { startProgress } from "./progress.js";
import { readOptionsFor } from "./read-prepared-graph.js";
import { needsFirstPass, resolveGrid } from "./resolve-grid.js";
import { createRunFolder, graphPaths, type RunFolder, removeLeftoverTemps, runFolder } from "./run-folder.js";
import type { ResolvedRunSpec, RunSpec } from "./run-spec.js";
import { renderSummary } from "./run-summary.js";
import { settingsFingerprint, specDifferences } from "./spec-differences.js";
import { runOnWorkers } from "./worker-pool.js";

/** All edge values the first pass may hold at once, over the whole dataset (128 MiB of float64). */
const FIRST_PASS_VALUES = 2 ** 24;

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
  const requested = validateSpec(request.spec, request.specSource);
  const dataset = openDataset(request.dataset, request.datasetOptions);
  // Files are named relative to the dataset's folder, so records and tables do not depend on where it sits.
  const base = dataset.kind === "folder" ? dataset.root : dirname(dataset.root);
  const relativeFile = (file: string) => relative(base, file).split(sep).join("/");
  const folder = runFolder(request.out);
  const previous = existsSync(folder.spec) ? validateSpec(readJson(folder.spec), folder.spec) : null;
  const hashes = dataset.entries.map((entry) => hashOrNote(entry.file));

  const problems: ErrorRow[] = dataset.problems.map((p) => problemRow(p, relativeFile(p.file)));
  const spec = await fixSpec(requested, previous, dataset, request);
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
  const featureNames = graphFeatureNames(featureConfigOf(spec), spec.resolvedGrid);

  createRunFolder(folder);
  removeLeftoverTemps(folder);
  writeFileAtomic(
    folder.spec,
    specDocument(spec, request.dataset, dataset, hashes, relativeFile, request.datasetOptions),
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
      outputsExist(folder, entry.id, spec)
    )
      records.set(entry.id, record);
    else todo.push(i);
  });
  const skipped = records.size;

  let failed = 0;
  const progress = startProgress("graphs", todo.length);
  const tasks = todo.map((i) => ({
    kind: "extract" as const,
    index: i,
    entry: dataset.entries[i],
    relativeFile: relativeFile(dataset.entries[i].file),
    labelCode: labelCode(dataset.entries[i].label, spec.labelNames),
  }));
  const ended = await runOnWorkers(
    tasks,
    (reply) => {
      if (reply.kind !== "extract") return;
      const entry = dataset.entries[reply.index];
      const record = saveGraph(folder, entry, reply.outcome, hashes[reply.index], fingerprint, relativeFile);
      records.set(entry.id, record);
      if (!record.ok) failed++;
      progress.update(records.size - skipped, failed);
    },
    {
      size: Math.max(1, Math.min(request.workers, todo.length)),
      setup: { kind: "setup", preparation: spec.preparation, spec },
      signal: request.signal,
      timeLimitSeconds: spec.complex.timeLimitSeconds,
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

  const tables = assembleTables(dataset.entries, records, featureNames, spec.labelNames, problems);
  writeFileAtomic(folder.featuresCsv, tables.featuresCsv);
  writeFileAtomic(folder.featuresNpz, tables.featuresNpz);
  writeFileAtomic(folder.errorsCsv, tables.errorsCsv);

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

/** Raised when an output folder holds results made under different settings. */
export class SpecMismatchError extends UsageError {}

/**
 * Completes the spec: the tool version, the grid (reused from the spec or the run folder, or resolved now,
 * with a first pass over the dataset for quantiles) and the label codes.
 */
async function fixSpec(
  requested: RunSpec,
  previous: RunSpec | null,
  dataset: Dataset,
  request: ExtractRequest,
): Promise<ResolvedRunSpec> {
  const spec: RunSpec = { ...requested, toolVersion: VERSION };
  const sameRequest =
    previous !== null &&
    specDifferences(
      { ...previous, resolvedGrid: undefined, labelNames: undefined, nodeLayout: undefined },
      {
        ...spec,
        resolvedGrid: undefined,
        labelNames: undefined,
        nodeLayout: undefined,
      },
    ).length === 0;
  // Re-running the same command on a run folder reuses its grid: the first pass is not redone.
  let resolvedGrid = spec.resolvedGrid ?? (sameRequest ? previous?.resolvedGrid : undefined);
  if (!resolvedGrid) {
    const sample = needsFirstPass(spec.grid) ? await firstPass(spec, dataset, request) : undefined;
    resolvedGrid = resolveGrid(spec.grid, spec.preparation.weights, sample);
  }
  try {
    checkFeatureAxis(resolvedGrid, spec.preparation.weights);
  } catch (error) {
    throw new UsageError(`resolvedGrid: ${(error as Error).message}`);
  }
  const known = spec.labelNames ?? (sameRequest ? previous?.labelNames : undefined) ?? [];
  const seen = [...new Set(dataset.entries.map((e) => e.label).filter((l): l is string => l !== null))];
  const labelNames = [...known, ...seen.filter((label) => !known.includes(label)).sort()];
  const anyDirected = dataset.entries.some((entry) => readOptionsFor(entry, spec.preparation).directed);
  const nodeLayout =
    spec.nodeLayout ??
    (sameRequest ? previous?.nodeLayout : undefined) ??
    (anyDirected ? "directed" : "undirected");
  return { ...spec, resolvedGrid, labelNames, nodeLayout, toolVersion: VERSION };
}

/** Reads every graph once (on the workers) and returns a bounded sample of all their edge values. */
async function firstPass(spec: RunSpec, dataset: Dataset, request: ExtractRequest): Promise<Float64Array> {
  const entries = dataset.entries;
  const limit = Math.max(1, Math.floor(FIRST_PASS_VALUES / Math.max(1, entries.length)));
  const parts: Float64Array[] = [];
  let failed = 0;
  let done = 0;
  const progress = startProgress("first pass (weight quantiles)", entries.length);
  const ended = await runOnWorkers(
    entries.map((entry, index) => ({ kind: "sample" as const, index, entry, limit })),
    (reply) => {
      if (reply.kind !== "sample") return;
      done++;
      if (reply.values) parts[reply.index] = reply.values;
      else failed++;
      progress.update(done, failed);
    },
    {
      size: Math.max(1, Math.min(request.workers, entries.length)),
      setup: { kind: "setup", preparation: spec.preparation, spec: null },
      signal: request.signal,
      timeLimitSeconds: spec.complex.timeLimitSeconds,
      // A graph that cannot be read here fails again, with its reason, when it is computed.
      failedReply: (task) => ({ kind: "sample", index: task.index, values: null, failure: null }),
    },
  );
  progress.stop();
  if (ended === "stopped")
    throw new InterruptedError("interrupted during the first pass; nothing was computed");
  // Dataset order, whatever order the workers answered in: the quantiles do not depend on scheduling.
  const total = parts.reduce((sum, part) => sum + (part?.length ?? 0), 0);
  const sample = new Float64Array(total);
  let at = 0;
  for (const part of parts) {
    if (!part) continue;
    sample.set(part, at);
    at += part.length;
  }
  return sample;
}

/** Ctrl-C before any graph was computed. */
export class InterruptedError extends Error {
  override name = "InterruptedError";
}

/** Writes one graph's barcode and bundle, then its record (last: the record says the graph is complete). */
function saveGraph(
  folder: RunFolder,
  entry: DatasetEntry,
  outcome: GraphOutcome,
  sha256: string,
  settings: string,
  relativeFile: (file: string) => string,
): GraphRecord {
  const paths = graphPaths(folder, entry.id);
  const base = {
    id: entry.id,
    file: relativeFile(entry.file),
    sha256,
    settings,
    label: entry.label,
    split: entry.split,
  };
  if (!outcome.ok) {
    const failure = { ...outcome.failure, file: relativeFile(outcome.failure.file) };
    const record: GraphRecord = { ...base, ok: false, failure, warnings: outcome.warnings };
    writeFileAtomic(paths.record, encodeRecord(record));
    return record;
  }
  if (outcome.barcodeJson !== null) writeFileAtomic(paths.barcode, outcome.barcodeJson);
  if (outcome.bundle !== null) writeFileAtomic(paths.bundle, outcome.bundle);
  const record: GraphRecord = {
    ...base,
    ok: true,
    values: Array.from(outcome.values, (v) => (Number.isNaN(v) ? null : v)),
    thresholds: outcome.thresholds,
    nodes: outcome.nodes,
    edges: outcome.edges,
    directed: outcome.directed,
    truncated: outcome.truncated,
    warnings: outcome.warnings,
  };
  writeFileAtomic(paths.record, encodeRecord(record));
  return record;
}

function outputsExist(folder: RunFolder, id: string, spec: ResolvedRunSpec): boolean {
  const paths = graphPaths(folder, id);
  return (
    (!spec.outputs.bundles || existsSync(paths.bundle)) &&
    (!spec.outputs.barcodes || existsSync(paths.barcode))
  );
}

/** spec.json: keys in a fixed order, the dataset's files with their hashes, no dates (reruns match byte for byte). */
function specDocument(
  spec: ResolvedRunSpec,
  datasetArgument: string,
  dataset: Dataset,
  hashes: string[],
  relativeFile: (file: string) => string,
  datasetOptions: OpenDatasetOptions | undefined,
): string {
  const document = {
    format: spec.format,
    toolVersion: spec.toolVersion,
    preparation: spec.preparation,
    complex: spec.complex,
    grid: spec.grid,
    resolvedGrid: spec.resolvedGrid,
    nodeFeatures: spec.nodeFeatures,
    families: spec.families,
    outputs: spec.outputs,
    labelNames: spec.labelNames,
    nodeLayout: spec.nodeLayout,
    dataset: datasetArgument,
    ...(datasetOptions && Object.values(datasetOptions).some((v) => v !== undefined)
      ? { datasetOptions }
      : {}),
    inputs: [
      ...(dataset.kind === "manifest"
        ? [
            {
              id: "(manifest)",
              file: relativeFile(datasetArgument),
              sha256: hashOrNote(datasetArgument),
            },
          ]
        : []),
      ...dataset.entries.map((entry, i) => ({
        id: entry.id,
        file: relativeFile(entry.file),
        sha256: hashes[i],
      })),
    ],
  };
  return `${JSON.stringify(document, null, 2)}\n`;
}

function readJson(path: string): Record<string, unknown> {
  return JSON.parse(readFileSync(path, "utf8")) as Record<string, unknown>;
}

/** The file's SHA-256, or "unreadable" (its reader will then say why, as the graph's error). */
function hashOrNote(path: string): string {
  try {
    return hashFile(path);
  } catch {
    return "unreadable";
  }
}

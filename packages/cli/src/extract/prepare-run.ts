import { existsSync, readFileSync } from "node:fs";
import { type Dataset, writeFileAtomic } from "@cliquescape/io";
import { UsageError } from "../options/graph-options.js";
import { type ErrorRow, problemRow } from "./assemble-tables.js";
import { checkInputsOutside } from "./check-out-folder.js";
import { readingPass } from "./first-pass.js";
import { hashInputs, hashOrNote } from "./input-hashes.js";
import { validateSpec } from "./load-spec.js";
import { noEdgeError } from "./no-edge-error.js";
import { openRunDataset } from "./open-run-dataset.js";
import { needsFirstPass, resolveGrid } from "./resolve-grid.js";
import { resolveSpec } from "./resolve-spec.js";
import type { ExtractRequest } from "./run-extract.js";
import { createRunFolder, type RunFolder, removeLeftoverTemps } from "./run-folder.js";
import type { ResolvedRunSpec, RunSpec } from "./run-spec.js";
import { specDifferences } from "./spec-differences.js";
import { specDocument } from "./spec-document.js";
import { tableSetProblem } from "./table-set.js";
import type { GraphSize } from "./worker-messages.js";

/** A run whose spec is fixed and written: what computing its graphs, or planning shards, starts from. */
export interface PreparedRun {
  folder: RunFolder;
  dataset: Dataset;
  relativeFile: (file: string) => string;
  spec: ResolvedRunSpec;
  /** Input file hashes in dataset order. */
  hashes: string[];
  /** errors.csv rows for manifest rows that named no usable graph. */
  problems: ErrorRow[];
  /** Each graph's prepared size, when asked for (a shard plan); null where it could not be read. */
  sizes: (GraphSize | null)[] | null;
}

/**
 * The first half of every extract run: fix the spec (first pass if the grid needs one), refuse to mix with a
 * run folder made under other settings, create the folder and write spec.json. With `measure`, every graph
 * is also read once for its size (the same pass gives the first pass's sample, so the grid is the one a
 * single run fixes).
 */
export async function prepareRun(
  request: ExtractRequest,
  folder: RunFolder,
  measure: boolean,
): Promise<PreparedRun> {
  const requested = validateSpec(request.spec, request.specSource);
  const { dataset, base, relativeFile } = openRunDataset(request.dataset, requested, request.datasetOptions);
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
  let sizes: (GraphSize | null)[] | null = null;
  let withGrid: RunSpec = requested;
  if (measure) {
    // One reading pass gives the sizes and, when the grid needs it, the first pass's very sample.
    // (A folder already holding a grid keeps it, as a re-run of extract does: resolveSpec decides.)
    const sampling = !requested.resolvedGrid && !previous?.resolvedGrid && needsFirstPass(requested.grid);
    const pass = await readingPass(requested, dataset, request, sampling);
    sizes = pass.sizes;
    if (sampling) {
      if (pass.sample.length === 0) throw noEdgeError(dataset.entries, pass.failures);
      const resolvedGrid = resolveGrid(requested.grid, requested.preparation.weights, pass.sample);
      withGrid = { ...requested, resolvedGrid };
    }
  }
  const spec = await resolveSpec(withGrid, previous, dataset, request);
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
  return { folder, dataset, relativeFile, spec, hashes, problems, sizes };
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

export function readJson(path: string): Record<string, unknown> {
  return JSON.parse(readFileSync(path, "utf8")) as Record<string, unknown>;
}

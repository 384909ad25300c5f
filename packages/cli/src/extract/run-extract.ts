import type { OpenDatasetOptions } from "@cliquescape/io";
import { computeGraphs } from "./compute-graphs.js";
import { type ExtractResult, finishRun } from "./finish-run.js";
import { prepareRun, SpecMismatchError } from "./prepare-run.js";
import { inRunFolder } from "./run-in-folder.js";
import { settingsFingerprint } from "./spec-differences.js";

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

/**
 * The extract job: fix the spec (first pass if the grid needs one), refuse to mix with a run folder made
 * under other settings, compute every graph not already done on worker threads, write each graph's files
 * as it finishes, then assemble the tables from the per-graph records in dataset order.
 */
export async function runExtract(request: ExtractRequest): Promise<ExtractResult> {
  return inRunFolder(request.out, request.dataset, async (folder, kept) => {
    const { dataset, relativeFile, spec, hashes, problems } = await prepareRun(request, folder, false);
    const { records, skipped, stopped } = await computeGraphs({
      folder,
      entries: dataset.entries,
      positions: dataset.entries.map((_, i) => i),
      hashes,
      spec,
      fingerprint: settingsFingerprint(spec),
      relativeFile,
      workers: request.workers,
      signal: request.signal,
      kept,
    });
    return finishRun({
      folder,
      spec,
      entries: dataset.entries,
      records,
      problems,
      skipped,
      interrupted: stopped,
    });
  });
}

export type { ExtractResult };
export { SpecMismatchError };

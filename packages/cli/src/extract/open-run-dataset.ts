import { dirname, relative, resolve, sep } from "node:path";
import { type Dataset, type OpenDatasetOptions, openDataset, openTimeSeriesDataset } from "@cliquescape/io";
import { recordingOptions } from "../connect/connectivity-spec.js";
import type { RunSpec } from "./run-spec.js";

/**
 * Opens an extract run's dataset as its spec says (recordings as such: a stack of recordings counts along its
 * subject axis) and names files relative to the dataset's folder, so records and tables do not depend on
 * where it sits. Every step of a run (plan, shard, single run) opens it here, so they agree on the entries.
 */
export function openRunDataset(
  datasetArgument: string,
  spec: RunSpec,
  datasetOptions: OpenDatasetOptions | undefined,
): { dataset: Dataset; base: string; relativeFile: (file: string) => string } {
  const maxFileMiB = spec.preparation.maxFileMiB;
  const maxBytes = maxFileMiB === null ? {} : { maxBytes: maxFileMiB * 2 ** 20 };
  const dataset = spec.connectivity
    ? openTimeSeriesDataset(datasetArgument, {
        ...datasetOptions,
        ...maxBytes,
        ...recordingOptions(spec.connectivity),
      })
    : openDataset(datasetArgument, { ...datasetOptions, ...maxBytes });
  if (dataset.kind === "manifest" && resolve(datasetArgument) !== dataset.root) {
    process.stderr.write(
      `cliquescape: ${datasetArgument} holds a manifest: reading the dataset from ${dataset.root}\n`,
    );
  }
  const base = dataset.kind === "folder" ? dataset.root : dirname(dataset.root);
  const relativeFile = (file: string) => relative(base, file).split(sep).join("/");
  return { dataset, base, relativeFile };
}

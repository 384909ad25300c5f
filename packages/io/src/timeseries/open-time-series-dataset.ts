import { closeSync, openSync, readSync, statSync } from "node:fs";
import { basename, extname, resolve } from "node:path";
import type { Dataset, OpenDatasetOptions } from "../dataset/dataset-types.js";
import { fileStem } from "../dataset/graph-file-extensions.js";
import { openDataset } from "../dataset/open-dataset.js";
import { loadStack, STACK_EXTENSIONS } from "../dataset/stack-source.js";
import { detectDelimiter, textRows } from "../text-rows.js";
import { subjectAxis } from "./subject-axis.js";
import type { TimeSeriesReadOptions } from "./time-series-read-options.js";

/**
 * Opens a dataset of recordings, one per entry: a folder of recording files, a manifest (a CSV/TSV whose
 * header names `id` and `file` columns), a stack (a 3-D .npy/.npz/.mat array of recordings), or a single
 * recording file (any other .csv, .tsv or .txt, or a 2-D array), as openDataset does for matrices. A stack's
 * recordings are counted along the subject axis (see subjectAxis), not along the axis of square matrices.
 */
export function openTimeSeriesDataset(
  path: string,
  options: OpenDatasetOptions & Pick<TimeSeriesReadOptions, "channelsFirst" | "channels"> = {},
): Dataset {
  const { channelsFirst, channels, ...datasetOptions } = options;
  const root = resolve(path);
  const extension = extname(root).toLowerCase();
  if (!isFile(root)) return openDataset(path, datasetOptions);
  if (STACK_EXTENSIONS.has(extension)) {
    const source = loadStack(root, options.variable);
    const { axis } = subjectAxis(source.array, root, { channelsFirst, channels });
    return openDataset(path, { ...datasetOptions, stackAxis: axis });
  }
  if ((extension === ".csv" || extension === ".tsv") && isManifest(root))
    return openDataset(path, datasetOptions);
  if (extension === ".csv" || extension === ".tsv" || extension === ".txt") {
    const entry = { id: fileStem(basename(root)), file: root, label: null, split: null, metadata: {} };
    return { root, kind: "file", entries: [{ ...entry, declaredAt: { file: root } }], problems: [] };
  }
  return openDataset(path, datasetOptions);
}

/** A manifest's first line names an id and a file column; a recording's names channels, or holds numbers. */
function isManifest(path: string): boolean {
  const fd = openSync(path, "r");
  const head = new Uint8Array(65536);
  let length: number;
  try {
    length = readSync(fd, head, 0, head.length, 0);
  } finally {
    closeSync(fd);
  }
  const text = new TextDecoder().decode(head.subarray(0, length));
  const delimiter = extname(path).toLowerCase() === ".tsv" ? "\t" : detectDelimiter(text);
  const first = textRows(text.slice(0, Math.max(0, text.lastIndexOf("\n"))) || text, delimiter, path).next();
  if (first.done) return false;
  const names = first.value.cells.map((cell) => cell.toLowerCase());
  return names.includes("id") && names.includes("file");
}

function isFile(path: string): boolean {
  try {
    return statSync(path).isFile();
  } catch {
    return false;
  }
}

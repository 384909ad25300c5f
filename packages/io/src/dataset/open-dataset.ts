import { statSync } from "node:fs";
import { basename, extname, resolve } from "node:path";
import { InputFileError } from "../input-file-error.js";
import type { Dataset, OpenDatasetOptions } from "./dataset-types.js";
import { findManifests } from "./find-manifests.js";
import { openFolderDataset } from "./open-folder.js";
import { openManifestDataset } from "./open-manifest.js";
import { openStackDataset } from "./open-stack.js";
import { STACK_EXTENSIONS } from "./stack-source.js";

const MANIFEST_EXTENSIONS = new Set([".csv", ".tsv"]);

/**
 * Opens a dataset without reading its graphs: a folder of graph files, a manifest CSV/TSV, or a stack file
 * (.npy, .npz, .mat) with an optional labels file. A folder holding a manifest (a .csv/.tsv whose header
 * names `id` and `file`) is read through that manifest; one holding several is an error asking which.
 * Paths in the result are absolute. A path that does not exist, or a manifest without id and file columns,
 * is an error; bad manifest rows are `problems`.
 */
export function openDataset(path: string, options: OpenDatasetOptions = {}): Dataset {
  const root = resolve(path);
  let isFolder: boolean;
  try {
    isFolder = statSync(root).isDirectory();
  } catch {
    throw new InputFileError(root, "unreadable", "no such file or folder");
  }
  const extension = extname(root).toLowerCase();
  let dataset: Dataset;
  if (isFolder) dataset = openFolderOrItsManifest(root);
  else if (MANIFEST_EXTENSIONS.has(extension)) dataset = openManifestDataset(root);
  else if (STACK_EXTENSIONS.has(extension)) {
    dataset = openStackDataset(
      root,
      options.labelsFile && resolve(options.labelsFile),
      options.variable,
      options.maxBytes,
      options.labelsColumn,
      options.stackAxis,
    );
  } else {
    throw new InputFileError(
      root,
      "unknown-format",
      "not a dataset: give a folder of graph files, a manifest (.csv, .tsv) or a stack (.npy, .npz, .mat)",
    );
  }
  if (options.labelsFile !== undefined && dataset.kind !== "stack") {
    throw new InputFileError(
      resolve(options.labelsFile),
      "bad-labels",
      "a labels file goes with a stack; a manifest has a label column",
    );
  }
  if (options.coordinatesFile !== undefined) {
    const coordinatesFile = resolve(options.coordinatesFile);
    try {
      if (!statSync(coordinatesFile).isFile()) throw new Error("not a file");
    } catch {
      throw new InputFileError(coordinatesFile, "unreadable", "coordinates file not found");
    }
    for (const entry of dataset.entries) entry.coordinatesFile ??= coordinatesFile;
  }
  return dataset;
}

function openFolderOrItsManifest(folder: string): Dataset {
  const manifests = findManifests(folder);
  if (manifests.length === 0) return openFolderDataset(folder);
  if (manifests.length === 1) return openManifestDataset(manifests[0]);
  throw new InputFileError(
    folder,
    "unknown-format",
    `the folder holds ${manifests.length} manifests (${manifests.map((m) => basename(m)).join(", ")}); pass the one to use`,
  );
}

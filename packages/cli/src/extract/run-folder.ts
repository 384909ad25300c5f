import { createHash } from "node:crypto";
import { existsSync, mkdirSync, readdirSync, rmdirSync, rmSync, statSync, writeFileSync } from "node:fs";
import { dirname, join } from "node:path";

/**
 * The run folder. Tables at the top, one file per graph below:
 *
 *   cliquescape-run.json the marker: this folder is a run folder of ours (nothing else is ever written into)
 *   run.lock             while a run works here: its pid, host and start time (run-folder-lock.ts)
 *   spec.json            every setting, the resolved grid, label codes, tool version, input hashes
 *   features.csv         one row per finished graph, dataset order
 *   features.npz         X, y, ids, feature_names, label_names, splits
 *   errors.csv           one row per graph (or manifest row) left out, with file, line, column, reason
 *   tables.json          length and SHA-256 of the three tables above, written after them (table-set.ts)
 *   barcodes/<id>.json   persistence barcode of each graph
 *   bundles/<id>.npz     GNN bundle of each graph
 *   graphs/<id>.json     the per-graph record the tables are assembled from (and resuming reads)
 */
export interface RunFolder {
  root: string;
  marker: string;
  lock: string;
  spec: string;
  featuresCsv: string;
  featuresNpz: string;
  errorsCsv: string;
  tablesManifest: string;
  barcodes: string;
  bundles: string;
  records: string;
}

export function runFolder(root: string): RunFolder {
  return {
    root,
    marker: join(root, RUN_FOLDER_MARKER),
    lock: join(root, "run.lock"),
    spec: join(root, "spec.json"),
    featuresCsv: join(root, "features.csv"),
    featuresNpz: join(root, "features.npz"),
    errorsCsv: join(root, "errors.csv"),
    tablesManifest: join(root, "tables.json"),
    barcodes: join(root, "barcodes"),
    bundles: join(root, "bundles"),
    records: join(root, "graphs"),
  };
}

/** The file that marks a folder as written by one of our commands, and what to call such a folder. */
export interface FolderMarker {
  file: string;
  kind: string;
}

/** The run folder's marker (its content is fixed: two runs of the same job give byte-identical folders). */
export const RUN_FOLDER_MARKER = "cliquescape-run.json";
export const RUN_FOLDER: FolderMarker = { file: RUN_FOLDER_MARKER, kind: "cliquescape run folder" };

/** What a marker file holds (one line, fixed). */
export function markerText(marker: FolderMarker): string {
  return JSON.stringify({ kind: marker.kind, version: 1 });
}

/** Creates the folder (if need be) and marks it as ours; call only after checkOutFolder accepted it. */
export function markFolder(root: string, marker: FolderMarker): void {
  makeFolder(root);
  const file = join(root, marker.file);
  if (!existsSync(file)) writeFileSync(file, `${markerText(marker)}\n`);
}

/** markFolder for a run folder. */
export function markRunFolder(folder: RunFolder): void {
  markFolder(folder.root, RUN_FOLDER);
}

/**
 * mkdir -p that reports the system's own reason: Node's recursive mkdir says ENOENT on a read-only file
 * system, where the truth is EROFS.
 */
function makeFolder(path: string): void {
  try {
    mkdirSync(path);
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === "EEXIST" && statSync(path).isDirectory()) return;
    if (code !== "ENOENT" || dirname(path) === path) throw error;
    makeFolder(dirname(path));
    mkdirSync(path);
  }
}

/**
 * Undoes markRunFolder when a run stopped before writing anything (a bad spec, no usable graph): the
 * marker goes, and the folder too if this run created it. Anything else in it leaves it as it is.
 */
export function unmarkIfEmpty(folder: RunFolder, existed: boolean): void {
  try {
    const names = readdirSync(folder.root).filter((name) => name !== "run.lock");
    if (names.length !== 1 || names[0] !== RUN_FOLDER_MARKER) return;
    rmSync(folder.marker, { force: true });
    if (!existed) rmdirSync(folder.root);
  } catch {
    // left as it is: the marker only says the folder is ours, which it still is
  }
}

export function createRunFolder(folder: RunFolder): void {
  for (const dir of [folder.root, folder.barcodes, folder.bundles, folder.records])
    mkdirSync(dir, { recursive: true });
}

/** Paths of one graph's files. */
export function graphPaths(
  folder: RunFolder,
  id: string,
): { record: string; barcode: string; bundle: string } {
  const stem = fileStem(id);
  return {
    record: join(folder.records, `${stem}.json`),
    barcode: join(folder.barcodes, `${stem}.json`),
    bundle: join(folder.bundles, `${stem}.npz`),
  };
}

/**
 * A file name for an id: the id itself when it is made of letters, digits, '.', '_' and '-' (and does not
 * start with '.'); otherwise those characters kept, the rest replaced by '_', and a short hash of the id
 * appended, so two ids never share a file.
 */
export function fileStem(id: string): string {
  if (/^[A-Za-z0-9_-][A-Za-z0-9._-]{0,150}$/.test(id)) return id;
  const hash = createHash("sha256").update(id).digest("hex").slice(0, 10);
  return `${id
    .replace(/[^A-Za-z0-9._-]/g, "_")
    .replace(/^\./, "_")
    .slice(0, 100)}~${hash}`;
}

/** Temporary files of io's writeFileAtomic (`.<name>.<pid>.<n>.tmp`) and of saveGraph (`…x<n>.tmp`). */
export const TEMPORARY_FILE = /^\..+\.\d+\.x?\d+\.tmp$/;

/**
 * Removes temporary files a killed process may have left (they are never a finished output). Only ever
 * called on a folder that carries our marker and whose lock this process holds.
 */
export function removeLeftoverTemps(folder: RunFolder): void {
  for (const dir of [folder.root, folder.barcodes, folder.bundles, folder.records]) {
    if (!existsSync(dir)) continue;
    for (const name of readdirSync(dir))
      if (TEMPORARY_FILE.test(name)) rmSync(join(dir, name), { force: true });
  }
}

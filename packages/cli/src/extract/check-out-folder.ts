import { existsSync, readdirSync, readFileSync, realpathSync, statSync } from "node:fs";
import { basename, dirname, join, relative, resolve, sep } from "node:path";
import { UsageError } from "../options/graph-options.js";
import { OutputIOError } from "./output-io-error.js";
import { type FolderMarker, markerText, RUN_FOLDER } from "./run-folder.js";

/** Raised when --out names a folder we must not write into (the user's own files, or the dataset). */
export class OutFolderError extends UsageError {}

/**
 * Whether `--out` may be written, decided before anything is read or computed: a new path, an empty
 * folder, or a folder carrying our marker. A file fails at once; a folder holding anything else is
 * refused, so no file of the user's is ever overwritten or removed (not even one named like our
 * temporary files). Returns whether the folder is ours already (a resumed run).
 */
export function checkOutFolder(
  out: string,
  dataset: string,
  marker: FolderMarker = RUN_FOLDER,
): { resumed: boolean } {
  if (isFolder(dataset) && realPath(out) === realPath(dataset)) throw sameFolderError(out, dataset);
  let outIsFolder: boolean;
  try {
    outIsFolder = statSync(out).isDirectory();
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === "ENOENT") return { resumed: false };
    throw new OutputIOError(error, out);
  }
  if (!outIsFolder)
    throw new OutputIOError(
      Object.assign(new Error("not a folder"), { code: "ENOTDIR", path: out, syscall: "mkdir" }),
      out,
    );
  if (existsSync(join(out, marker.file))) return { resumed: true };
  let names: string[];
  try {
    names = readdirSync(out);
  } catch (error) {
    throw new OutputIOError(error, out);
  }
  if (names.length === 0) return { resumed: false };
  const shown = names.slice(0, 3).join(", ") + (names.length > 3 ? ", …" : "");
  throw new OutFolderError(
    `--out ${out} already holds files (${shown}) and is not a ${marker.kind} (it has no ` +
      `${marker.file}); refusing to write into it, so nothing in it is changed. Choose a new or ` +
      `empty folder.${marker === RUN_FOLDER ? earlierRunHint(out) : ""}`,
  );
}

/**
 * The run folder must hold none of the run's inputs and must not be the dataset's folder: otherwise a
 * second run would read its own tables as graphs, or overwrite an input. A run folder inside a folder
 * dataset is fine: only the files directly in the dataset's folder are read, never those of sub-folders.
 */
export function checkInputsOutside(out: string, datasetFolder: string, inputs: readonly string[]): void {
  const outReal = realPath(out);
  const folderReal = realPath(datasetFolder);
  if (outReal === folderReal) throw sameFolderError(out, datasetFolder);
  // Each input's real folder, looked up once per folder: a million graphs sit in a few folders.
  const realFolders = new Map<string, string>();
  for (const input of inputs) {
    const folder = dirname(resolve(input));
    let real = realFolders.get(folder);
    if (real === undefined) {
      real = realPath(folder);
      realFolders.set(folder, real);
    }
    if (isInside(join(real, basename(input)), outReal))
      throw new OutFolderError(
        `--out ${out} holds an input of the run (${input}); the run would overwrite or read its own ` +
          "outputs. Choose another --out folder.",
      );
  }
}

function sameFolderError(out: string, datasetFolder: string): OutFolderError {
  const beside = join(dirname(resolve(datasetFolder)), `${basename(resolve(datasetFolder))}-run`);
  return new OutFolderError(
    `--out ${out} is the dataset's folder (${datasetFolder}); the run's tables would be read as graphs ` +
      `by the next run. Choose a folder outside it, e.g. ${beside}.`,
  );
}

function isFolder(path: string): boolean {
  try {
    return statSync(path).isDirectory();
  } catch {
    return false;
  }
}

/** The real path of `path`, or of its nearest existing folder with the rest appended (path not made yet). */
function realPath(path: string): string {
  const absolute = resolve(path);
  let existing = absolute;
  while (!existsSync(existing)) {
    const parent = dirname(existing);
    if (parent === existing) return absolute;
    existing = parent;
  }
  return join(realpathSync(existing), relative(existing, absolute));
}

function isInside(path: string, folder: string): boolean {
  return path === folder || path.startsWith(folder.endsWith(sep) ? folder : folder + sep);
}

// A run folder written before folders carried a marker: say how to adopt it, without doing it for the user.
function earlierRunHint(out: string): string {
  try {
    const spec = JSON.parse(readFileSync(join(out, "spec.json"), "utf8")) as { format?: unknown };
    if (spec.format === "cliquescape-run-spec/1" && existsSync(join(out, "graphs")))
      return (
        ` If it is a run folder written by an earlier cliquescape, mark it as one and run again: ` +
        `echo '${markerText(RUN_FOLDER)}' > ${join(out, RUN_FOLDER.file)}`
      );
  } catch {
    // no spec of ours: no hint
  }
  return "";
}

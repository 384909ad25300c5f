import { checkInputsOutside, checkOutFolder } from "../extract/check-out-folder.js";
import { isOutputIOError, OutputIOError } from "../extract/output-io-error.js";
import { type FolderMarker, markFolder, runFolder } from "../extract/run-folder.js";
import { lockRunFolder, type RunFolderLock } from "../extract/run-folder-lock.js";

/** The marker of a folder `connect` writes. */
export const CONNECT_FOLDER: FolderMarker = {
  file: "cliquescape-connect.json",
  kind: "cliquescape connectivity folder",
};

/**
 * Makes `out` the connectivity folder of this run, with extract's rules: refused before anything is
 * computed when it is a file, a folder of the user's own files (connect replaces matrices.npy, ids.txt,
 * manifest.csv … and must never remove someone else's), the dataset's folder or a folder holding a
 * recording; locked against a second run writing the same folder (exit 75).
 */
export function claimConnectFolder(
  out: string,
  dataset: string,
  datasetFolder: string,
  inputs: readonly string[],
): RunFolderLock {
  checkOutFolder(out, dataset, CONNECT_FOLDER);
  checkInputsOutside(out, datasetFolder, inputs);
  try {
    markFolder(out, CONNECT_FOLDER);
    return lockRunFolder(runFolder(out), out);
  } catch (error) {
    if (!isOutputIOError(error, out)) throw error;
    throw new OutputIOError(error, out, "nothing was written; run the same command again once it can be");
  }
}

import { existsSync } from "node:fs";
import { checkOutFolder } from "./check-out-folder.js";
import { isOutputIOError, OutputIOError } from "./output-io-error.js";
import { markRunFolder, type RunFolder, runFolder, unmarkIfEmpty } from "./run-folder.js";
import { lockRunFolder, type RunFolderLock } from "./run-folder-lock.js";

/**
 * Runs `work` in the run folder `out`, made ours and locked: refused at once when `out` is a file, someone
 * else's folder or the dataset's folder (checkOutFolder), or when another run holds it. Every step that
 * writes a run folder goes through here: a single run, a plan and a merge on the run folder, a shard on its
 * own part folder (so shards of one run never wait for each other). `kept.graphs` counts the graphs saved,
 * for the message when a write fails; a run that stops before writing anything leaves no marker behind.
 */
export async function inRunFolder<T>(
  out: string,
  dataset: string,
  work: (folder: RunFolder, kept: { graphs: number }) => Promise<T>,
): Promise<T> {
  const { resumed } = checkOutFolder(out, dataset);
  const folder = runFolder(out);
  const existed = existsSync(folder.root);
  const kept = { graphs: 0 };
  // A write the system refuses (full, read-only, no permission) becomes one line naming --out and the path.
  const restated = (error: unknown) =>
    isOutputIOError(error, out)
      ? new OutputIOError(
          error,
          out,
          kept.graphs > 0
            ? `the ${kept.graphs} graphs finished are kept; run the same command again to finish`
            : "nothing in the folder was lost; run the same command again once it can be written",
        )
      : error;
  let lock: RunFolderLock;
  try {
    markRunFolder(folder);
    // One run per folder at a time: a second one refuses at once, naming the holder.
    lock = lockRunFolder(folder, out);
  } catch (error) {
    throw restated(error);
  }
  try {
    const result = await work(folder, kept);
    lock.release();
    return result;
  } catch (error) {
    lock.release();
    // A run that stopped before writing anything leaves the folder as it found it.
    if (!resumed) unmarkIfEmpty(folder, existed);
    throw restated(error);
  }
}

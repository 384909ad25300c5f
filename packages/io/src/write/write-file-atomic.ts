import { closeSync, fsyncSync, mkdirSync, openSync, renameSync, rmSync, writeSync } from "node:fs";
import { basename, dirname, join } from "node:path";
import { threadId } from "node:worker_threads";

let counter = 0;

/**
 * Writes a file so that readers see either the old content or the whole new content, never half of it:
 * the bytes go to a temporary file in the same folder (a rename is atomic only within one file system),
 * are flushed to disk, and the temporary file is renamed over the target. Missing folders are created.
 * `data` may come in pieces (text or bytes), written as they are produced: a table larger than any one
 * string or buffer can hold is written without ever being whole in memory.
 */
export function writeFileAtomic(
  path: string,
  data: string | Uint8Array | Iterable<string | Uint8Array>,
): void {
  const folder = dirname(path);
  mkdirSync(folder, { recursive: true });
  // Unique per process, worker thread and call, so concurrent writers never share a temporary file.
  const temporary = join(folder, `.${basename(path)}.${process.pid}.${threadId}.${counter++}.tmp`);
  const pieces = typeof data === "string" || data instanceof Uint8Array ? [data] : data;
  let fd: number | undefined;
  try {
    fd = openSync(temporary, "w");
    for (const piece of pieces) {
      const bytes = typeof piece === "string" ? Buffer.from(piece, "utf8") : piece;
      let written = 0;
      while (written < bytes.length) written += writeSync(fd, bytes, written, bytes.length - written);
    }
    fsyncSync(fd);
    closeSync(fd);
    fd = undefined;
    renameSync(temporary, path);
  } catch (error) {
    if (fd !== undefined) closeSync(fd);
    rmSync(temporary, { force: true });
    throw error;
  }
  syncFolder(folder);
}

// The rename itself lives in the folder's entry list; flushing the folder makes it survive a power cut.
// Some systems refuse to open folders for syncing; the file is complete either way.
function syncFolder(folder: string): void {
  let fd: number | undefined;
  try {
    fd = openSync(folder, "r");
    fsyncSync(fd);
  } catch {
    // best effort
  } finally {
    if (fd !== undefined) closeSync(fd);
  }
}

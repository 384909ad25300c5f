import { createHash } from "node:crypto";
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
  stageFile(path, data).commit();
}

/** A file written and flushed under a temporary name, waiting to be renamed into place. */
export interface StagedFile {
  path: string;
  temporary: string;
  /** Its length and SHA-256 (hex), computed as the bytes were written. */
  bytes: number;
  sha256: string;
  /** Renames it into place and flushes the folder's entry. */
  commit(): void;
  /** Removes the temporary file (nothing changes at `path`). */
  discard(): void;
}

/**
 * The first half of writeFileAtomic: the whole content on disk under a temporary name, nothing at `path`
 * changed yet. Several files staged first and committed together can only disagree if the process stops
 * between their renames, never because one of them could not be written (a full disk fails here).
 */
export function stageFile(
  path: string,
  data: string | Uint8Array | Iterable<string | Uint8Array>,
): StagedFile {
  const folder = dirname(path);
  mkdirSync(folder, { recursive: true });
  // Unique per process, worker thread and call, so concurrent writers never share a temporary file.
  const temporary = join(folder, `.${basename(path)}.${process.pid}.${threadId}.${counter++}.tmp`);
  const pieces = typeof data === "string" || data instanceof Uint8Array ? [data] : data;
  const hash = createHash("sha256");
  let total = 0;
  let fd: number | undefined;
  try {
    fd = openSync(temporary, "w");
    for (const piece of pieces) {
      const bytes = typeof piece === "string" ? Buffer.from(piece, "utf8") : piece;
      hash.update(bytes);
      total += bytes.length;
      let written = 0;
      while (written < bytes.length) written += writeSync(fd, bytes, written, bytes.length - written);
    }
    fsyncSync(fd);
    closeSync(fd);
    fd = undefined;
  } catch (error) {
    if (fd !== undefined) closeSync(fd);
    rmSync(temporary, { force: true });
    // Name the file being written, not its temporary name (writeSync's errors name no file at all).
    if (error && typeof error === "object") Object.assign(error, { path });
    throw error;
  }
  return {
    path,
    temporary,
    bytes: total,
    sha256: hash.digest("hex"),
    commit: () => {
      try {
        renameSync(temporary, path);
      } catch (error) {
        rmSync(temporary, { force: true });
        throw error;
      }
      syncFolder(folder);
    },
    discard: () => rmSync(temporary, { force: true }),
  };
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

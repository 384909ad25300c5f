import { createHash } from "node:crypto";
import { closeSync, openSync, readSync } from "node:fs";
import { InputFileError } from "../input-file-error.js";

const CHUNK = 1 << 20;

/** SHA-256 of a file's bytes, hex, read a megabyte at a time so any size fits in memory. */
export function hashFile(path: string): string {
  const hash = createHash("sha256");
  const buffer = Buffer.allocUnsafe(CHUNK);
  let fd: number;
  try {
    fd = openSync(path, "r");
  } catch (error) {
    throw new InputFileError(path, "unreadable", `cannot read file: ${(error as Error).message}`);
  }
  try {
    for (;;) {
      const read = readSync(fd, buffer, 0, CHUNK, null);
      if (read === 0) break;
      hash.update(buffer.subarray(0, read));
    }
  } catch (error) {
    throw new InputFileError(path, "unreadable", `cannot read file: ${(error as Error).message}`);
  } finally {
    closeSync(fd);
  }
  return hash.digest("hex");
}

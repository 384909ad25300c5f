import { createHash } from "node:crypto";
import { closeSync, openSync, readSync } from "node:fs";

const CHUNK = 1 << 20;

/** SHA-256 of a file's bytes, hex, read a megabyte at a time so any size fits in memory. */
export function hashFile(path: string): string {
  const hash = createHash("sha256");
  const buffer = Buffer.allocUnsafe(CHUNK);
  const fd = openSync(path, "r");
  try {
    for (;;) {
      const read = readSync(fd, buffer, 0, CHUNK, null);
      if (read === 0) break;
      hash.update(buffer.subarray(0, read));
    }
  } finally {
    closeSync(fd);
  }
  return hash.digest("hex");
}

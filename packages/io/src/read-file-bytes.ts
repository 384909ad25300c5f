import { readFileSync, type Stats, statSync } from "node:fs";
import { InputFileError } from "./input-file-error.js";
import { checkByteSize } from "./read-options.js";

// The text decoder needs no Node API; it lives apart so browsers can import it.
export { decodeText } from "./decode-text.js";

/** Reads a whole file after checking its size, so a huge file is refused with a message, not a crash. */
export function readFileBytes(path: string, maxBytes: number): Uint8Array {
  let size: number;
  try {
    const stat = statSync(path);
    if (!stat.isFile())
      throw new InputFileError(path, "unreadable", `not a regular file (${fileKind(stat)})`);
    size = stat.size;
  } catch (error) {
    if (error instanceof InputFileError) throw error;
    throw new InputFileError(
      path,
      "unreadable",
      `cannot read file: ${(error as Error).message}`,
      {},
      { cause: error },
    );
  }
  checkByteSize(path, size, maxBytes);
  try {
    return readFileSync(path);
  } catch (error) {
    throw new InputFileError(
      path,
      "unreadable",
      `cannot read file: ${(error as Error).message}`,
      {},
      { cause: error },
    );
  }
}

/** What a path that is not a regular file is, in words: "a directory", "a FIFO (named pipe)", … */
export function fileKind(stat: Stats): string {
  if (stat.isDirectory()) return "a directory";
  if (stat.isFIFO()) return "a FIFO (named pipe)";
  if (stat.isCharacterDevice()) return "a character device";
  if (stat.isBlockDevice()) return "a block device";
  if (stat.isSocket()) return "a socket";
  return "not a file";
}

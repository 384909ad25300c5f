import { readFileSync, statSync } from "node:fs";
import { InputFileError } from "./input-file-error.js";
import { formatBytes } from "./read-options.js";

/** Reads a whole file after checking its size, so a huge file is refused with a message, not a crash. */
export function readFileBytes(path: string, maxBytes: number): Uint8Array {
  let size: number;
  try {
    const stat = statSync(path);
    if (!stat.isFile()) throw new InputFileError(path, "unreadable", "not a regular file");
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
  if (size > maxBytes) {
    throw new InputFileError(
      path,
      "too-large",
      `file is ${formatBytes(size)}, more than the limit of ${formatBytes(maxBytes)}; raise maxBytes if you have the memory`,
    );
  }
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

/** Decodes UTF-8 strictly: a binary or wrongly encoded file is an error, not a page of replacement characters. */
export function decodeText(bytes: Uint8Array, file: string): string {
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    throw new InputFileError(file, "unreadable", "file is not UTF-8 text (is it a binary file?)");
  }
}

import { InputFileError } from "./input-file-error.js";

/** Decodes UTF-8 strictly: a binary or wrongly encoded file is an error, not a page of replacement characters. */
export function decodeText(bytes: Uint8Array, file: string): string {
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    throw new InputFileError(file, "unreadable", "file is not UTF-8 text (is it a binary file?)");
  }
}

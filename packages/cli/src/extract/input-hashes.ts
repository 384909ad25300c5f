import { hashFile } from "@cliquescape/io";

/**
 * The SHA-256 of each file, in order; a file named twice (the slices of one stack) is read once. A file that
 * cannot be read gets "unreadable": its reader will say why, as that graph's error.
 */
export function hashInputs(files: readonly string[]): string[] {
  const known = new Map<string, string>();
  return files.map((file) => {
    let hash = known.get(file);
    if (hash === undefined) {
      hash = hashOrNote(file);
      known.set(file, hash);
    }
    return hash;
  });
}

/** The file's SHA-256, or "unreadable" (its reader will then say why, as the graph's error). */
export function hashOrNote(path: string): string {
  try {
    return hashFile(path);
  } catch {
    return "unreadable";
  }
}

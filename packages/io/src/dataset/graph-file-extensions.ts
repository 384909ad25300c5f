import { extname } from "node:path";

/** Extensions readGraphFile reads: the files a dataset folder is made of. */
export const GRAPH_FILE_EXTENSIONS: ReadonlySet<string> = new Set([
  ".csv",
  ".tsv",
  ".txt",
  ".npy",
  ".npz",
  ".mat",
  ".graphml",
  ".gexf",
]);

/** Whether readGraphFile can tell this file's format from its extension. */
export function isGraphFileName(name: string): boolean {
  return GRAPH_FILE_EXTENSIONS.has(extname(name).toLowerCase());
}

/** The file name without its extension: a graph's id in a folder dataset. */
export function fileStem(name: string): string {
  const extension = extname(name);
  return extension === "" ? name : name.slice(0, -extension.length);
}

import { closeSync, openSync, readdirSync, readSync } from "node:fs";
import { extname, join } from "node:path";
import { textRows } from "../text-rows.js";
import { isManifestHeader } from "./open-manifest.js";

// A header line is short; a graph file's first bytes are enough to tell it is not a manifest.
const HEAD_BYTES = 8192;

/**
 * The manifests lying directly in `folder`: .csv and .tsv files whose first line names the columns `id`
 * and `file`, sorted by name. A folder holding one is a dataset described by it, not a folder of graphs.
 */
export function findManifests(folder: string): string[] {
  return readdirSync(folder, { withFileTypes: true })
    .filter(
      (d) =>
        !d.name.startsWith(".") && d.isFile() && [".csv", ".tsv"].includes(extname(d.name).toLowerCase()),
    )
    .map((d) => join(folder, d.name))
    .filter(startsWithManifestHeader)
    .sort();
}

function startsWithManifestHeader(path: string): boolean {
  let head: string;
  try {
    const fd = openSync(path, "r");
    try {
      const bytes = Buffer.alloc(HEAD_BYTES);
      head = bytes.toString("utf8", 0, readSync(fd, bytes, 0, HEAD_BYTES, 0)).replace(/^\ufeff/, "");
    } finally {
      closeSync(fd);
    }
  } catch {
    return false; // unreadable here: the folder's reader will say so
  }
  const firstLine = head
    .split(/\r?\n/)
    .find((line) => line.trim() !== "" && !line.trimStart().startsWith("#"));
  if (firstLine === undefined) return false;
  const delimiter = extname(path).toLowerCase() === ".tsv" ? "\t" : ",";
  const row = textRows(firstLine, delimiter, path).next();
  return !row.done && isManifestHeader(row.value.cells);
}

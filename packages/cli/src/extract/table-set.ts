import { createHash } from "node:crypto";
import { closeSync, existsSync, openSync, readFileSync, readSync } from "node:fs";
import { basename } from "node:path";
import { type StagedFile, stageFile, writeFileAtomic } from "@cliquescape/io";
import type { RunTables } from "./assemble-tables.js";
import type { RunFolder } from "./run-folder.js";

/** tables.json: the length and SHA-256 of each table of the last complete set, written after the tables. */
export interface TableSetManifest {
  format: "cliquescape-tables/1";
  graphs: number;
  errors: number;
  files: Record<string, { bytes: number; sha256: string }>;
}

/**
 * Writes features.csv, features.npz and errors.csv as one set. All three are first written whole and
 * flushed under temporary names (a full disk fails here and changes nothing), then renamed into place in a
 * fixed order, then tables.json records their lengths and checksums. Only a stop between the renames can
 * leave the tables disagreeing, and checkTableSet then says so: the previous tables.json no longer matches.
 * The next run rewrites all three from the per-graph records.
 */
export function writeTableSet(folder: RunFolder, tables: RunTables): void {
  const staged: StagedFile[] = [];
  try {
    staged.push(stageFile(folder.featuresCsv, tables.featuresCsv));
    staged.push(stageFile(folder.featuresNpz, tables.featuresNpz));
    staged.push(stageFile(folder.errorsCsv, tables.errorsCsv));
  } catch (error) {
    for (const file of staged) file.discard();
    throw error;
  }
  const manifest: TableSetManifest = {
    format: "cliquescape-tables/1",
    graphs: tables.rows,
    errors: tables.errors.length,
    files: Object.fromEntries(
      staged.map((file) => [basename(file.path), { bytes: file.bytes, sha256: file.sha256 }]),
    ),
  };
  let committed = 0;
  try {
    for (const file of staged) {
      file.commit();
      committed++;
    }
  } finally {
    for (const file of staged.slice(committed)) file.discard();
  }
  writeFileAtomic(folder.tablesManifest, `${JSON.stringify(manifest, null, 2)}\n`);
}

/**
 * Whether the folder's three tables are the set tables.json describes (lengths, then SHA-256). A run
 * folder of ours without tables.json but with tables was stopped while writing its first set. Folders
 * written before tables.json existed (no marker) are not checked. Returns null when the set is whole,
 * otherwise what is wrong.
 */
export function tableSetProblem(folder: RunFolder): string | null {
  if (!existsSync(folder.marker)) return null;
  const tables = [folder.featuresCsv, folder.featuresNpz, folder.errorsCsv];
  if (!existsSync(folder.tablesManifest)) {
    const present = tables.filter((path) => existsSync(path));
    return present.length === 0
      ? null
      : `${basename(folder.tablesManifest)} is missing: the run was stopped while writing its first tables`;
  }
  let manifest: TableSetManifest;
  try {
    manifest = JSON.parse(readFileSync(folder.tablesManifest, "utf8")) as TableSetManifest;
  } catch {
    return `${basename(folder.tablesManifest)} cannot be read`;
  }
  for (const path of tables) {
    const expected = manifest.files?.[basename(path)];
    if (!expected) return `${basename(folder.tablesManifest)} does not list ${basename(path)}`;
    const actual = fileDigest(path);
    if (actual === null) return `${basename(path)} is missing`;
    if (actual.bytes !== expected.bytes || actual.sha256 !== expected.sha256)
      return `${basename(path)} is not the one ${basename(folder.tablesManifest)} lists (${actual.bytes} bytes, ${expected.bytes} expected${actual.bytes === expected.bytes ? ", other content" : ""})`;
  }
  return null;
}

/** Length and SHA-256 of a file, read in blocks (a table may be larger than memory); null if absent. */
export function fileDigest(path: string): { bytes: number; sha256: string } | null {
  let fd: number;
  try {
    fd = openSync(path, "r");
  } catch {
    return null;
  }
  try {
    const hash = createHash("sha256");
    const block = Buffer.allocUnsafe(1 << 20);
    let bytes = 0;
    for (;;) {
      const n = readSync(fd, block, 0, block.length, null);
      if (n === 0) break;
      hash.update(block.subarray(0, n));
      bytes += n;
    }
    return { bytes, sha256: hash.digest("hex") };
  } finally {
    closeSync(fd);
  }
}

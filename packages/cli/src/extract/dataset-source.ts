import { existsSync, readdirSync, readFileSync, statSync } from "node:fs";
import { basename, dirname, extname, join, resolve } from "node:path";
import { detectDelimiter, InputFileError, textRows } from "@cliquescape/io";

/*
 * Opening a dataset: a manifest CSV or a folder of graph files. This follows the contract of the io
 * package's dataset reader (being written alongside); once it lands, this file becomes a re-export of it.
 */

export interface DatasetEntry {
  id: string;
  file: string;
  label: string | null;
  split: string | null;
  metadata: Record<string, string>;
  directed?: boolean;
  slice?: number;
  declaredAt: { file: string; line?: number };
}

export interface DatasetProblem {
  id: string | null;
  file: string;
  line?: number;
  column?: number;
  reason: string;
}

export interface Dataset {
  root: string;
  kind: "folder" | "manifest" | "stack";
  entries: DatasetEntry[];
  problems: DatasetProblem[];
}

const GRAPH_EXTENSIONS = new Set([".csv", ".tsv", ".txt", ".npy"]);
const RESERVED_COLUMNS = new Set(["id", "file", "label", "split", "directed"]);

/** A manifest file (CSV with `id` and `file` columns) or a folder whose graph files are the dataset. */
export function openDataset(path: string): Dataset {
  if (!existsSync(path)) throw new InputFileError(path, "unreadable", "no such file or folder");
  return statSync(path).isDirectory() ? openFolder(path) : openManifest(path);
}

function openFolder(folder: string): Dataset {
  const files = readdirSync(folder)
    .filter((name) => GRAPH_EXTENSIONS.has(extname(name).toLowerCase()))
    .sort();
  const entries = files.map((name) => ({
    id: basename(name, extname(name)),
    file: join(folder, name),
    label: null,
    split: null,
    metadata: {},
    declaredAt: { file: folder },
  }));
  const problems = duplicateIdProblems(entries);
  const unique = entries.filter((entry, i) => entries.findIndex((other) => other.id === entry.id) === i);
  return { root: resolve(folder), kind: "folder", entries: unique, problems };
}

function openManifest(manifest: string): Dataset {
  const text = readFileSync(manifest, "utf8");
  const rows = [...textRows(text, detectDelimiter(text), manifest)];
  if (rows.length === 0) throw new InputFileError(manifest, "empty-file", "the manifest has no header line");
  const header = rows[0].cells.map((cell) => cell.toLowerCase());
  for (const required of ["id", "file"]) {
    if (!header.includes(required)) {
      throw new InputFileError(manifest, "bad-header", `the manifest header has no "${required}" column`, {
        line: rows[0].line,
      });
    }
  }
  const column = (name: string) => header.indexOf(name);
  const base = dirname(manifest);
  const entries: DatasetEntry[] = [];
  const problems: DatasetProblem[] = [];
  const firstLine = new Map<string, number>();
  for (const { line, cells } of rows.slice(1)) {
    const id = cells[column("id")] ?? "";
    const fileCell = cells[column("file")] ?? "";
    if (cells.length !== header.length) {
      problems.push({
        id: id || null,
        file: manifest,
        line,
        column: Math.min(cells.length, header.length) + 1,
        reason: `manifest row has ${cells.length} cells but the header has ${header.length}`,
      });
      continue;
    }
    if (id === "" || fileCell === "") {
      const missing = id === "" ? "id" : "file";
      problems.push({
        id: id || null,
        file: manifest,
        line,
        column: column(missing) + 1,
        reason: `manifest row has an empty "${missing}" cell`,
      });
      continue;
    }
    if (firstLine.has(id)) {
      problems.push({
        id,
        file: manifest,
        line,
        column: column("id") + 1,
        reason: `duplicate id "${id}" (first declared on line ${firstLine.get(id)}); this row is skipped`,
      });
      continue;
    }
    firstLine.set(id, line);
    const file = resolve(base, fileCell);
    if (!existsSync(file)) {
      problems.push({
        id,
        file: manifest,
        line,
        column: column("file") + 1,
        reason: `file not found: ${fileCell}`,
      });
      continue;
    }
    const metadata: Record<string, string> = {};
    header.forEach((name, i) => {
      if (!RESERVED_COLUMNS.has(name)) metadata[rows[0].cells[i]] = cells[i];
    });
    const cell = (name: string) =>
      column(name) >= 0 && cells[column(name)] !== "" ? cells[column(name)] : null;
    const directedCell = cell("directed");
    entries.push({
      id,
      file,
      label: cell("label"),
      split: cell("split"),
      metadata,
      ...(directedCell === null ? {} : { directed: /^(true|1|yes)$/i.test(directedCell) }),
      declaredAt: { file: manifest, line },
    });
  }
  return { root: resolve(base), kind: "manifest", entries, problems };
}

function duplicateIdProblems(entries: DatasetEntry[]): DatasetProblem[] {
  const seen = new Set<string>();
  const problems: DatasetProblem[] = [];
  for (const entry of entries) {
    if (seen.has(entry.id)) {
      problems.push({
        id: entry.id,
        file: entry.file,
        reason: `duplicate id "${entry.id}" (two files share a name)`,
      });
    }
    seen.add(entry.id);
  }
  return problems;
}

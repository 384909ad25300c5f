import { statSync } from "node:fs";
import { dirname, extname, isAbsolute, resolve } from "node:path";
import { InputFileError } from "../input-file-error.js";
import { decodeText, fileKind, readFileBytes } from "../read-file-bytes.js";
import { DEFAULT_MAX_TEXT_BYTES } from "../read-options.js";
import { type TextRow, textRows } from "../text-rows.js";
import type { Dataset, DatasetEntry, DatasetProblem } from "./dataset-types.js";
import { isGraphFileName } from "./graph-file-extensions.js";

/** Columns with a meaning; any other column is kept as metadata. */
const KNOWN_COLUMNS = ["id", "file", "label", "split", "directed", "coords"] as const;
type KnownColumn = (typeof KNOWN_COLUMNS)[number];

/**
 * Reads a manifest: a CSV (or TSV) whose header names the columns `id` and `file` (a path relative to the
 * manifest's folder), optionally `label`, `split`, `directed` (true/false) and `coords` (a node-coordinates
 * CSV), and any other columns, kept as metadata. A bad row becomes a problem with its line and column and
 * the other rows stay; a manifest without `id` or `file` columns is an error.
 */
export function openManifestDataset(manifest: string): Dataset {
  const text = decodeText(readFileBytes(manifest, DEFAULT_MAX_TEXT_BYTES), manifest);
  const rows = textRows(text, extname(manifest).toLowerCase() === ".tsv" ? "\t" : ",", manifest);
  const first = rows.next();
  if (first.done) throw new InputFileError(manifest, "empty-file", "the manifest has no header line");
  const columns = headerColumns(first.value, manifest);
  const folder = dirname(manifest);
  const entries: DatasetEntry[] = [];
  const problems: DatasetProblem[] = [];
  const firstLineOf = new Map<string, number>();
  for (const row of rows) {
    const entry = readRow(row, columns, manifest, folder, (column, reason, id) =>
      problems.push({ id, file: manifest, line: row.line, column, reason }),
    );
    if (!entry) continue;
    const earlier = firstLineOf.get(entry.id);
    if (earlier !== undefined) {
      problems.push({
        id: entry.id,
        file: manifest,
        line: row.line,
        column: (columns.known.id as number) + 1,
        reason: `duplicate id "${entry.id}" (first on line ${earlier}); this row is skipped`,
      });
      continue;
    }
    firstLineOf.set(entry.id, row.line);
    entries.push(entry);
  }
  return { root: manifest, kind: "manifest", entries, problems };
}

/** Whether a header line names the two columns a manifest needs, `id` and `file` (any case). */
export function isManifestHeader(cells: readonly string[]): boolean {
  const names = cells.map((cell) => cell.trim().toLowerCase());
  return names.includes("id") && names.includes("file");
}

interface Columns {
  names: string[];
  known: Partial<Record<KnownColumn, number>>;
}

function headerColumns(header: TextRow, manifest: string): Columns {
  const known: Partial<Record<KnownColumn, number>> = {};
  const seen = new Set<string>();
  header.cells.forEach((cell, k) => {
    const position = { line: header.line, column: k + 1 };
    if (cell === "") throw new InputFileError(manifest, "bad-header", "a column has no name", position);
    if (seen.has(cell))
      throw new InputFileError(manifest, "bad-header", `column "${cell}" appears twice`, position);
    seen.add(cell);
    const name = cell.toLowerCase() as KnownColumn;
    if ((KNOWN_COLUMNS as readonly string[]).includes(name)) known[name] = k;
  });
  const only = header.cells.length === 1 ? header.cells[0] : "";
  const other = only.includes("\t") ? "tab" : only.includes(";") ? "semicolon" : undefined;
  if (other !== undefined && known.id === undefined) {
    const extension = extname(manifest).toLowerCase();
    throw new InputFileError(
      manifest,
      "bad-header",
      `the header line is ${other}-separated, but a ${extension} manifest is read as ${extension === ".tsv" ? "tab" : "comma"}-separated; ` +
        (other === "tab"
          ? "name the file .tsv, or separate its columns with commas"
          : "separate its columns with commas"),
      { line: header.line },
    );
  }
  for (const required of ["id", "file"] as const) {
    if (known[required] === undefined) {
      throw new InputFileError(
        manifest,
        "bad-header",
        `the manifest has no "${required}" column; its header is ${header.cells.join(",")} (needed: id, file; optional: label, split, directed, coords)`,
        { line: header.line },
      );
    }
  }
  return { names: header.cells, known };
}

type Report = (column: number, reason: string, id: string | null) => void;

function readRow(
  row: TextRow,
  columns: Columns,
  manifest: string,
  folder: string,
  report: Report,
): DatasetEntry | undefined {
  const { cells } = row;
  const at = (name: KnownColumn) => columns.known[name];
  const cell = (name: KnownColumn) => {
    const k = at(name);
    return k === undefined ? "" : (cells[k] ?? "");
  };
  const column = (name: KnownColumn) => (at(name) as number) + 1;
  const id = cell("id");
  if (cells.length !== columns.names.length) {
    const k = Math.min(cells.length, columns.names.length) + 1;
    report(k, `the row has ${cells.length} cells but the header has ${columns.names.length}`, id || null);
    return undefined;
  }
  if (id === "") {
    report(column("id"), "empty id", null);
    return undefined;
  }
  const fileCell = cell("file");
  if (fileCell === "") {
    report(column("file"), "empty file path", id);
    return undefined;
  }
  const file = isAbsolute(fileCell) ? fileCell : resolve(folder, fileCell);
  if (!isGraphFileName(file)) {
    report(column("file"), `cannot tell the format of "${fileCell}" from its extension`, id);
    return undefined;
  }
  const fileProblem = notARegularFile(file);
  if (fileProblem) {
    report(column("file"), `${fileProblem}: ${fileCell} (looked for ${file})`, id);
    return undefined;
  }
  const entry: DatasetEntry = {
    id,
    file,
    label: cell("label") || null,
    split: cell("split") || null,
    metadata: {},
    declaredAt: { file: manifest, line: row.line },
  };
  const directed = cell("directed").toLowerCase();
  if (directed === "true" || directed === "false") entry.directed = directed === "true";
  else if (directed !== "") {
    report(
      column("directed"),
      `directed is "${cell("directed")}"; write true or false (or leave it empty)`,
      id,
    );
    return undefined;
  }
  const coords = cell("coords");
  if (coords !== "") {
    const coordinatesFile = isAbsolute(coords) ? coords : resolve(folder, coords);
    const coordsProblem = notARegularFile(coordinatesFile);
    if (coordsProblem) {
      report(column("coords"), `coordinates ${coordsProblem}: ${coords} (looked for ${coordinatesFile})`, id);
      return undefined;
    }
    entry.coordinatesFile = coordinatesFile;
  }
  const knownIndices = new Set(Object.values(columns.known));
  columns.names.forEach((name, k) => {
    if (!knownIndices.has(k)) entry.metadata[name] = cells[k];
  });
  return entry;
}

/** Why `path` cannot be read as a file ("file not found", "not a regular file (a directory)"), or undefined. */
function notARegularFile(path: string): string | undefined {
  let stat: ReturnType<typeof statSync>;
  try {
    stat = statSync(path);
  } catch {
    return "file not found";
  }
  return stat.isFile() ? undefined : `not a regular file (${fileKind(stat)})`;
}

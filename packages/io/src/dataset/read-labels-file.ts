import { InputFileError } from "../input-file-error.js";
import { decodeText, readFileBytes } from "../read-file-bytes.js";
import { DEFAULT_MAX_TEXT_BYTES } from "../read-options.js";
import { detectDelimiter, textRows } from "../text-rows.js";

/** One row of a labels table: an id of the user's (or of the stack), its label, split and other columns. */
export interface LabelRow {
  id: string;
  label: string | null;
  split: string | null;
  metadata: Record<string, string>;
  line: number;
  /** Column of the id cell, 1-based. */
  column: number;
}

/** Labels for a stack: by position (one per line) or a table with a header (id, label, …). */
export type StackLabels =
  | { kind: "by-position"; labels: (string | null)[]; lines: number[] }
  | { kind: "table"; rows: LabelRow[] };

/**
 * Id columns, in order of preference: ours, then the participant and subject columns of participant tables
 * (`participant_id` is the column the BIDS standard gives participants.tsv).
 */
const ID_COLUMNS = ["id", "participant_id", "subject_id", "subject"];

/**
 * Reads a labels file. A first line naming an id column (`id`, `participant_id`, `subject_id` or
 * `subject`) makes it a table: one row per graph, the label in the `labelsColumn` column (default `label`),
 * an optional `split` column, any other column kept as metadata. Otherwise every line is one label, in
 * slice order (an empty line is a graph without a label; trailing empty lines are ignored).
 */
export function readLabelsFile(path: string, labelsColumn?: string): StackLabels {
  const text = decodeText(readFileBytes(path, DEFAULT_MAX_TEXT_BYTES), path).replace(/^\ufeff/, "");
  const delimiter = detectDelimiter(text);
  const rows = textRows(text, delimiter === "whitespace" ? "," : delimiter, path);
  const header = rows.next();
  const names = header.done ? [] : header.value.cells.map((c) => c.trim().toLowerCase());
  const idName = ID_COLUMNS.find((id) => names.includes(id));
  const idColumn = idName === undefined ? -1 : names.indexOf(idName);
  if (header.done || idColumn < 0) {
    if (labelsColumn !== undefined) {
      throw new InputFileError(
        path,
        "bad-header",
        `the first line names no id column (${ID_COLUMNS.join(", ")}), so the file is one label per line and has no column "${labelsColumn}"`,
        { line: 1 },
      );
    }
    return byPosition(text);
  }
  const wanted = (labelsColumn ?? "label").toLowerCase();
  const labelColumn = names.indexOf(wanted);
  if (labelColumn < 0) {
    throw new InputFileError(
      path,
      "bad-header",
      `the header has no "${wanted}" column (it has ${header.value.cells.join(", ")}); name the column of labels with the labelsColumn option`,
      { line: header.value.line },
    );
  }
  const splitColumn = names.indexOf("split");
  const table: LabelRow[] = [];
  const firstLine = new Map<string, number>();
  for (const row of rows) {
    const at = { line: row.line, column: idColumn + 1 };
    const id = row.cells[idColumn] ?? "";
    if (id === "") throw new InputFileError(path, "bad-labels", "empty id", at);
    const earlier = firstLine.get(id);
    if (earlier !== undefined) {
      throw new InputFileError(
        path,
        "bad-labels",
        `id "${id}" is labelled twice (first on line ${earlier})`,
        at,
      );
    }
    firstLine.set(id, row.line);
    const metadata: Record<string, string> = {};
    header.value.cells.forEach((name, k) => {
      if (k !== idColumn && k !== labelColumn && k !== splitColumn) metadata[name] = row.cells[k] ?? "";
    });
    table.push({
      id,
      label: row.cells[labelColumn] || null,
      split: (splitColumn < 0 ? "" : row.cells[splitColumn]) || null,
      metadata,
      ...at,
    });
  }
  return { kind: "table", rows: table };
}

function byPosition(text: string): StackLabels {
  const lines = text.split("\n").map((line) => line.replace(/\r$/, "").trim());
  while (lines.length > 0 && lines[lines.length - 1] === "") lines.pop();
  return {
    kind: "by-position",
    labels: lines.map((line) => line || null),
    lines: lines.map((_, k) => k + 1),
  };
}

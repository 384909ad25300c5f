import { InputFileError } from "../input-file-error.js";
import { decodeText, readFileBytes } from "../read-file-bytes.js";
import { DEFAULT_MAX_TEXT_BYTES } from "../read-options.js";
import { detectDelimiter, textRows } from "../text-rows.js";

/** Labels for a stack: by position (one per line) or by id (a CSV with id and label columns). */
export type StackLabels =
  | { kind: "by-position"; labels: (string | null)[]; lines: number[] }
  | { kind: "by-id"; labels: Map<string, { label: string | null; line: number; column: number }> };

/**
 * Reads a labels file. A first line naming the columns `id` and `label` makes it a CSV keyed by id;
 * otherwise every line is one label, in slice order (an empty line is a graph without a label; trailing
 * empty lines are ignored).
 */
export function readLabelsFile(path: string): StackLabels {
  const text = decodeText(readFileBytes(path, DEFAULT_MAX_TEXT_BYTES), path).replace(/^\ufeff/, "");
  const delimiter = detectDelimiter(text);
  const rows = textRows(text, delimiter === "whitespace" ? "," : delimiter, path);
  const header = rows.next();
  const names = header.done ? [] : header.value.cells.map((c) => c.toLowerCase());
  if (!header.done && names.includes("id") && names.includes("label")) {
    const idColumn = names.indexOf("id");
    const labelColumn = names.indexOf("label");
    const labels = new Map<string, { label: string | null; line: number; column: number }>();
    for (const row of rows) {
      const id = row.cells[idColumn] ?? "";
      if (id === "")
        throw new InputFileError(path, "bad-labels", "empty id", { line: row.line, column: idColumn + 1 });
      const earlier = labels.get(id);
      if (earlier) {
        throw new InputFileError(
          path,
          "bad-labels",
          `id "${id}" is labelled twice (first on line ${earlier.line})`,
          {
            line: row.line,
            column: idColumn + 1,
          },
        );
      }
      labels.set(id, { label: row.cells[labelColumn] || null, line: row.line, column: idColumn + 1 });
    }
    return { kind: "by-id", labels };
  }
  const lines = text.split("\n").map((line) => line.replace(/\r$/, "").trim());
  while (lines.length > 0 && lines[lines.length - 1] === "") lines.pop();
  return {
    kind: "by-position",
    labels: lines.map((line) => line || null),
    lines: lines.map((_, k) => k + 1),
  };
}

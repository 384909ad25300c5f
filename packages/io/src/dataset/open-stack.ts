import { basename } from "node:path";
import { graphCount, type StackAxis } from "../formats/matrix-stack.js";
import { InputFileError } from "../input-file-error.js";
import type { Dataset, DatasetEntry, DatasetProblem } from "./dataset-types.js";
import { fileStem } from "./graph-file-extensions.js";
import { type LabelRow, readLabelsFile } from "./read-labels-file.js";
import { loadStack } from "./stack-source.js";

/**
 * One entry per graph of a stack file (3-D .npy, .npz or .mat): ids `<stem>-<k>`, k zero-padded to the
 * width of the last index so that ids sort in slice order. Labels (and split and metadata) come from an
 * optional labels file; a labels table of the user's own ids gives the slices those ids, in order.
 * `axis` overrides the axis the matrix reader would count along (time series choose their own).
 */
export function openStackDataset(
  file: string,
  labelsFile?: string,
  variable?: string,
  maxBytes?: number,
  labelsColumn?: string,
  axis?: StackAxis,
): Dataset {
  const source = loadStack(file, variable, maxBytes);
  const { shape } = source.array;
  if (shape.length !== 2 && shape.length !== 3) {
    throw new InputFileError(
      file,
      "not-square",
      `array of shape (${shape.join(", ")}) is not a stack of matrices`,
    );
  }
  const count = graphCount(source.array, axis ?? source.axis);
  const stem = fileStem(basename(file));
  const width = String(Math.max(0, count - 1)).length;
  const entries: DatasetEntry[] = [];
  for (let k = 0; k < count; k++) {
    const entry: DatasetEntry = {
      id: `${stem}-${String(k).padStart(width, "0")}`,
      file,
      label: null,
      split: null,
      metadata: {},
      slice: k,
      declaredAt: { file },
    };
    if (source.variable !== undefined) entry.variable = source.variable;
    entries.push(entry);
  }
  const problems: DatasetProblem[] = [];
  if (labelsFile !== undefined) applyLabels(entries, labelsFile, labelsColumn, problems);
  return { root: file, kind: "stack", entries, problems };
}

function applyLabels(
  entries: DatasetEntry[],
  labelsFile: string,
  labelsColumn: string | undefined,
  problems: DatasetProblem[],
): void {
  const labels = readLabelsFile(labelsFile, labelsColumn);
  if (labels.kind === "by-position") {
    if (labels.labels.length !== entries.length) {
      throw new InputFileError(
        labelsFile,
        "bad-labels",
        `${labels.labels.length} labels for a stack of ${entries.length} graphs; give one label per line, in slice order`,
      );
    }
    entries.forEach((entry, k) => {
      entry.label = labels.labels[k];
      entry.declaredAt = { file: labelsFile, line: labels.lines[k] };
    });
    return;
  }
  const byId = new Map(entries.map((entry) => [entry.id, entry]));
  const range = `${entries[0]?.id} … ${entries[entries.length - 1]?.id}`;
  // Rows naming the stack's own ids label those slices; a table of the user's own ids names the slices in order.
  if (!labels.rows.some((row) => byId.has(row.id))) {
    if (labels.rows.length !== entries.length) {
      throw new InputFileError(
        labelsFile,
        "bad-labels",
        `${labels.rows.length} rows for a stack of ${entries.length} graphs: ids such as "${labels.rows[0]?.id}" are not the stack's (${range}), so the rows must name the slices in order, one row per slice`,
      );
    }
    labels.rows.forEach((row, k) => {
      const entry = entries[k];
      entry.id = row.id;
      label(entry, row, labelsFile);
    });
    return;
  }
  for (const row of labels.rows) {
    const entry = byId.get(row.id);
    if (!entry) {
      problems.push({
        id: row.id,
        file: labelsFile,
        line: row.line,
        column: row.column,
        reason: `no graph "${row.id}" in the stack (ids run ${range})`,
      });
      continue;
    }
    label(entry, row, labelsFile);
  }
}

function label(entry: DatasetEntry, row: LabelRow, labelsFile: string): void {
  entry.label = row.label;
  entry.split = row.split;
  entry.metadata = row.metadata;
  entry.declaredAt = { file: labelsFile, line: row.line };
}

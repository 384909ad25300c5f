import { axisSuffixes, type FeatureAxis, type WeightSemantics } from "@cliquescape/core";
import { textRows } from "@cliquescape/io/browser";

/**
 * The run folder written by `cliquescape extract`, as the page reads it. This module is the one place in
 * the viewer that knows the folder's files and columns (spec.json, features.csv, errors.csv); everything
 * else works on the RunFolder it returns.
 */
export interface RunFolder {
  settings: {
    weights: WeightSemantics;
    topDim: number;
    prime: number;
    /** The grid every curve column is read on. */
    axis: FeatureAxis;
    labelNames: string[];
    toolVersion: string | null;
  };
  featureNames: string[];
  graphs: RunGraph[];
  errors: RunError[];
}

export interface RunGraph {
  id: string;
  label: string;
  split: string;
  /** True when the top dimension hid simplices, so Euler columns are partial sums; null when not said. */
  truncated: boolean | null;
  /** Aligned with featureNames; NaN for an empty cell. */
  values: Float64Array;
}

export interface RunError {
  id: string;
  file: string;
  line: string;
  reason: string;
}

/** The files the page needs, by their names in the run folder. */
export const RUN_FILES = ["spec.json", "features.csv", "errors.csv"] as const;

// features.csv starts with these columns (runs before truncated was added lack it); the features follow.
const KEY_COLUMNS = ["id", "label", "split"];
const TRUNCATED_COLUMN = "truncated";

/** Parses the run's files; a file that does not look like extract's output is an error naming it. */
export function readRunFolder(files: Record<string, string>): RunFolder {
  const spec = JSON.parse(required(files, "spec.json")) as {
    format?: string;
    toolVersion?: string;
    preparation?: { weights?: WeightSemantics };
    complex?: { topDim?: number; prime?: number };
    resolvedGrid?: { kind: "weight" | "density"; values: number[] };
    labelNames?: string[];
  };
  if (spec.format !== "cliquescape-run-spec/1" || !spec.resolvedGrid)
    throw new Error(
      'spec.json: not the spec of a finished run (no "format": "cliquescape-run-spec/1" or no resolved grid)',
    );
  const table = [...textRows(required(files, "features.csv"), ",", "features.csv")];
  if (table.length === 0 || KEY_COLUMNS.some((name, i) => table[0].cells[i] !== name))
    throw new Error(`features.csv: the first columns must be ${KEY_COLUMNS.join(", ")}`);
  const keys = KEY_COLUMNS.length + (table[0].cells[KEY_COLUMNS.length] === TRUNCATED_COLUMN ? 1 : 0);
  const featureNames = table[0].cells.slice(keys);
  const graphs = table.slice(1).map(({ cells }) => ({
    id: cells[0],
    label: cells[1],
    split: cells[2],
    truncated: keys > KEY_COLUMNS.length && cells[3] !== "" ? cells[3] === "true" : null,
    values: Float64Array.from(featureNames, (_, j) => {
      const cell = cells[keys + j];
      return cell === undefined || cell === "" ? Number.NaN : Number(cell);
    }),
  }));
  const errorRows = files["errors.csv"] ? [...textRows(files["errors.csv"], ",", "errors.csv")] : [];
  const errorHeader = errorRows[0]?.cells ?? [];
  const errors = errorRows.slice(1).map(({ cells }) => {
    const cell = (name: string) => cells[errorHeader.indexOf(name)] ?? "";
    return { id: cell("id"), file: cell("file"), line: cell("line"), reason: cell("reason") };
  });
  return {
    settings: {
      weights: spec.preparation?.weights ?? "similarity",
      topDim: spec.complex?.topDim ?? 3,
      prime: spec.complex?.prime ?? 2,
      axis: { kind: spec.resolvedGrid.kind, values: spec.resolvedGrid.values },
      labelNames: spec.labelNames ?? [...new Set(graphs.map((g) => g.label))].sort(),
      toolVersion: spec.toolVersion ?? null,
    },
    featureNames,
    graphs,
    errors,
  };
}

/** Column indices of one curve (e.g. "betti_d1", "euler") over the run's grid, or null when absent. */
export function curveColumns(run: RunFolder, curve: string): number[] | null {
  const columns = axisSuffixes(run.settings.axis).map((suffix) =>
    run.featureNames.indexOf(`${curve}_${suffix}`),
  );
  return columns.every((c) => c >= 0) ? columns : null;
}

/** The curves a run holds, in the order extract writes them. */
export function runCurves(run: RunFolder): string[] {
  const names = [];
  for (let k = 0; k < run.settings.topDim; k++) names.push(`betti_d${k}`);
  names.push("euler");
  for (let k = 1; k <= run.settings.topDim; k++) names.push(`simplices_d${k}`);
  return names.filter((name) => curveColumns(run, name) !== null);
}

function required(files: Record<string, string>, name: string): string {
  const text = files[name];
  if (text === undefined) throw new Error(`the run folder has no ${name}`);
  return text;
}

import { isAbsolute, relative, resolve } from "node:path";
import { negativePolicy } from "@cliquescape/io";
import { formatWeight } from "../render/format-number.js";
import { textTable } from "../render/text-table.js";
import type { ErrorRow } from "./assemble-tables.js";
import type { GraphRecord } from "./graph-record.js";
import { labelMeans } from "./label-means.js";
import type { RunFolder } from "./run-folder.js";
import type { ResolvedRunSpec } from "./run-spec.js";

export interface SummaryInput {
  folder: RunFolder;
  spec: ResolvedRunSpec;
  featureNames: readonly string[];
  records: readonly GraphRecord[];
  totalGraphs: number;
  skipped: number;
  errors: readonly ErrorRow[];
  interrupted: boolean;
}

const ERRORS_SHOWN = 10;

/** The closing report: what was done, where the outputs are, per-label means of a few headline features. */
export function renderSummary(input: SummaryInput): string {
  const { folder, spec, records, errors } = input;
  const ok = records.filter((r) => r.ok).length;
  const at = (path: string) => {
    const near = relative(process.cwd(), path);
    return near.startsWith("..") || isAbsolute(near) ? resolve(path) : near || ".";
  };
  const lines: string[] = [];
  const status = input.interrupted ? "interrupted" : "done";
  const waiting = input.totalGraphs - records.length;
  lines.push(
    `${status}: ${ok} graphs in the tables` +
      `${input.skipped > 0 ? ` (${input.skipped} already done before this run)` : ""}, ${errors.length} left out` +
      `${waiting > 0 ? `, ${waiting} not reached yet` : ""}`,
  );
  const axis = spec.resolvedGrid;
  const range = `${formatWeight(axis.values[0])} .. ${formatWeight(axis.values[axis.values.length - 1])}`;
  lines.push(
    `grid: ${axis.values.length} ${axis.kind === "weight" ? `${spec.preparation.weights} thresholds` : "edge densities"} ${range}; ` +
      `${input.featureNames.length} features per graph`,
  );
  lines.push(negativesLine(spec, records));
  lines.push("");
  lines.push("outputs:");
  const outputs: [string, string][] = [
    [at(folder.featuresCsv), "feature table (one row per graph)"],
    [at(folder.featuresNpz), "X, y, ids, feature_names, label_names for numpy"],
    [at(folder.spec), "settings, grid, input hashes (reuse with --spec)"],
    ...(spec.outputs.bundles
      ? [[`${at(folder.bundles)}/`, "GNN bundles (x, edge_index, edge_attr, y)"] as [string, string]]
      : []),
    ...(spec.outputs.barcodes
      ? [[`${at(folder.barcodes)}/`, "persistence barcodes (JSON)"] as [string, string]]
      : []),
    [at(folder.errorsCsv), `graphs left out and why (${errors.length})`],
  ];
  const width = Math.max(...outputs.map(([path]) => path.length));
  for (const [path, what] of outputs) lines.push(`  ${path.padEnd(width)}  ${what}`);
  const means = labelMeans(records, input.featureNames, spec.labelNames);
  if (means.features.length > 0 && means.rows.length > 0) {
    lines.push("");
    lines.push("mean per label:");
    lines.push(
      textTable(
        ["label", "graphs", ...means.features],
        means.rows.map((row) => [row.label, String(row.graphs), ...row.means.map((m) => formatMean(m))]),
      ),
    );
  }
  if (errors.length > 0) {
    lines.push("");
    lines.push(`left out (${errors.length}; all in ${at(folder.errorsCsv)}):`);
    for (const e of errors.slice(0, ERRORS_SHOWN)) {
      const position = e.line === null ? "" : `:${e.line}${e.column === null ? "" : `:${e.column}`}`;
      lines.push(`  ${e.id || "(no id)"}: ${e.file}${position}: ${e.reason}`);
    }
    if (errors.length > ERRORS_SHOWN) lines.push(`  … and ${errors.length - ERRORS_SHOWN} more`);
  }
  // Reader notes (self-loops dropped, values rounded, …) are kept in each graph's record; name the graphs.
  const noted = records.filter((r) => r.warnings.length > 0);
  if (noted.length > 0) {
    lines.push("");
    lines.push(`reader notes for ${noted.length} graph(s) (all in ${at(folder.records)}/<id>.json):`);
    for (const r of noted.slice(0, ERRORS_SHOWN))
      lines.push(`  ${r.id}: ${r.file}: ${r.warnings.join("; ")}`);
    if (noted.length > ERRORS_SHOWN) lines.push(`  … and ${noted.length - ERRORS_SHOWN} more`);
  }
  if (input.interrupted) lines.push("\nrun the same command again to finish: finished graphs are kept");
  return `${lines.join("\n")}\n`;
}

/**
 * What became of negative weights, always printed: the default drops negative similarities, which changes
 * the topology of correlation matrices, so a reader of the log must see it.
 */
function negativesLine(spec: ResolvedRunSpec, records: readonly GraphRecord[]): string {
  const { negatives, transform, weights } = spec.preparation;
  // Under "auto" the values as read decide: those are similarities whenever there is a transform.
  const semantics = transform === "none" ? weights : "similarity";
  const policy = negativePolicy({ negative: negatives === "auto" ? undefined : negatives, semantics });
  const changed = records.filter((r) => r.warnings.some((w) => / negative weight/.test(w))).length;
  const what = {
    drop: `dropped (no edge) in ${changed} of ${records.length} graphs`,
    abs: `replaced by their absolute value in ${changed} of ${records.length} graphs`,
    keep: "kept as they are",
    error: "refused (a graph with one is left out)",
  }[policy];
  const why = negatives === "auto" ? `--negatives auto, for ${semantics} values` : `--negatives ${negatives}`;
  return `negative weights: ${what} (${why}); NaN cells: ${spec.preparation.nanCells === "no-edge" ? "no edge" : "refused"}`;
}

function formatMean(x: number): string {
  if (!Number.isFinite(x)) return String(x);
  return Math.abs(x) >= 1000 ? x.toFixed(0) : Number(x.toPrecision(4)).toString();
}

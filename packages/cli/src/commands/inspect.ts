import {
  allEdgesGrid,
  bettiFromBarcode,
  countSimplices,
  density,
  edgeCount,
  thresholdSubgraph,
} from "@cliquescape/core";
import { encodeCsv } from "@cliquescape/io";
import { Command } from "commander";
import { barcodeWithinBudget } from "../barcode-within-budget.js";
import { loadGraph } from "../load-graph.js";
import { addComplexOptions, complexOptionsOf } from "../options/complex-options.js";
import { addGraphOptions, GRAPH_FILE_HELP, graphOptionsOf } from "../options/graph-options.js";
import { addOutputOptions, type OutputFormat } from "../options/output-options.js";
import { addSpecOption, specOf } from "../options/spec-option.js";
import { addSingleThresholdOptions, gridOf, thresholdChoiceOf } from "../options/threshold-options.js";
import { formatCount, formatWeight } from "../render/format-number.js";
import { keyValueLines, textTable } from "../render/text-table.js";
import { startGraphWork } from "../work-progress.js";

/** The JSON object `inspect --format json` prints. Stable: later versions only add fields. */
export interface InspectReport {
  file: string;
  directed: boolean;
  weights: "distance" | "similarity";
  /** Threshold in weight units; null when every edge is kept. */
  threshold: number | null;
  nodes: number;
  edges: number;
  density: number;
  /** counts[k] = number of k-simplices. */
  counts: number[];
  euler: number;
  /** True when --top-dim hid simplices of higher dimension (then euler is a partial sum). */
  truncated: boolean;
  /** betti[k] = k-th Betti number over Z/prime, k = 0 .. top-dim − 1; null when not computed. */
  betti: number[] | null;
  prime: number;
}

export function inspectCommand(): Command {
  const command = new Command("inspect")
    .summary("one graph at one threshold: size, simplex counts, Euler characteristic, Betti numbers")
    .description(
      "Reads one graph, keeps the edges present at the threshold (all edges if none is given), counts the " +
        "simplices of its clique complex (undirected) or directed flag complex (--directed) per dimension, and " +
        "prints the Euler characteristic and the Betti numbers over Z/p.",
    )
    .argument("<file>", GRAPH_FILE_HELP);
  addGraphOptions(command);
  addSpecOption(command);
  addSingleThresholdOptions(command);
  addComplexOptions(command);
  addOutputOptions(command);
  command.addHelpText(
    "after",
    `
Examples:
  cliquescape inspect demo-data/graphs/ring01u.csv
  cliquescape inspect subject07.csv --threshold 0.4 --top-dim 3
  cliquescape inspect net.npy --directed --density 0.1 --format json`,
  );
  command.action((file: string, raw: Record<string, unknown>, self: Command) => {
    const given = (name: string) => self.getOptionValueSource(name) === "cli";
    const spec = specOf(raw);
    const graphOptions = graphOptionsOf(raw, spec, given);
    const weights = graphOptions.preparation.weights;
    const choice = thresholdChoiceOf(raw);
    const { graph } = loadGraph(file, graphOptions);
    const limits = complexOptionsOf(raw, spec, given);
    const thresholded = choice.threshold !== undefined || choice.density !== undefined;
    const threshold = thresholded ? gridOf(graph, weights, choice).thresholds[0] : undefined;
    // Homology of the complex at the threshold only: the subgraph keeps the work to what is asked.
    const kept = threshold === undefined ? graph : thresholdSubgraph(graph, threshold, weights);
    const work = startGraphWork(file, limits.timeLimitSeconds);
    const { result, barcode } = (() => {
      try {
        const counted = countSimplices(graph, {
          ...work.control,
          threshold,
          semantics: weights,
          maxDim: limits.topDim,
          budget: limits.budget,
        });
        return { result: counted, barcode: barcodeWithinBudget(kept, weights, limits, work.control) };
      } finally {
        work.stop();
      }
    })();
    const counts = Array.from(result.counts);
    const bettiThreshold = threshold ?? allEdgesGrid(graph, weights).thresholds[0];
    const report: InspectReport = {
      file,
      directed: graph.directed,
      weights,
      threshold: threshold ?? null,
      nodes: graph.n,
      // From the graph, not from the counts: --top-dim 0 counts no edges.
      edges: edgeCount(kept),
      density: density(kept),
      counts,
      euler: result.euler,
      truncated: result.truncated,
      betti: barcode && bettiFromBarcode(barcode, bettiThreshold),
      prime: limits.prime,
    };
    process.stdout.write(renderInspect(report, raw.format as OutputFormat));
  });
  return command;
}

export function renderInspect(report: InspectReport, format: OutputFormat): string {
  if (format === "json") return `${JSON.stringify(report, null, 2)}\n`;
  const dims = report.counts.map((_, k) => k);
  const bettiDims = (report.betti ?? []).map((_, k) => k);
  if (format === "csv") {
    return encodeCsv(
      [
        "file",
        "threshold",
        "nodes",
        "edges",
        "density",
        ...dims.map((k) => `simplices_${k}`),
        "euler",
        "truncated",
        ...bettiDims.map((k) => `betti_${k}`),
      ],
      [
        [
          report.file,
          report.threshold ?? "",
          report.nodes,
          report.edges,
          report.density,
          ...report.counts,
          report.euler,
          String(report.truncated),
          ...(report.betti ?? []),
        ],
      ],
    );
  }
  const kind = report.directed ? "directed flag complex" : "clique complex";
  const keep =
    report.threshold === null
      ? "all edges"
      : `${report.weights === "similarity" ? "w ≥" : "w ≤"} ${formatWeight(report.threshold)}`;
  const summary = keyValueLines([
    ["graph", `${report.file}  (${report.nodes} nodes, ${report.directed ? "directed" : "undirected"})`],
    ["kept", `${keep}  (${report.weights} weights)`],
    ["edges", `${formatCount(report.edges)}  (density ${report.density.toFixed(4)})`],
    ["euler", `${report.euler}${report.truncated ? "  (partial: --top-dim hid higher simplices)" : ""}`],
  ]);
  const betti = report.betti;
  const table = textTable(
    ["dim", kind === "clique complex" ? "simplices" : "directed simplices", `betti (Z/${report.prime})`],
    dims.map((k) => [
      String(k),
      formatCount(report.counts[k]),
      betti && k < betti.length ? String(betti[k]) : "–",
    ]),
  );
  return `${summary}\n\n${table}\n`;
}

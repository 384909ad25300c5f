import {
  bettiCurves,
  edgeBins,
  edgeFiltration,
  gridFiltrationValues,
  possibleEdgeCount,
  sweepSimplexCounts,
  type ThresholdGrid,
  thresholdSubgraph,
  type WeightedGraph,
} from "@cliquescape/core";
import { encodeCsv } from "@cliquescape/io";
import { Command } from "commander";
import { barcodeWithinBudget } from "../barcode-within-budget.js";
import { loadGraph } from "../load-graph.js";
import { addComplexOptions, complexOptionsOf } from "../options/complex-options.js";
import { addGraphOptions, GRAPH_FILE_HELP, graphOptionsOf } from "../options/graph-options.js";
import { addOutputOptions, type OutputFormat } from "../options/output-options.js";
import { addSpecOption, specOf } from "../options/spec-option.js";
import { addGridOptions, gridChoiceOf, gridOf } from "../options/threshold-options.js";
import { formatCount, formatWeight } from "../render/format-number.js";
import { textTable } from "../render/text-table.js";
import { startGraphWork } from "../work-progress.js";

/** The JSON object `sweep --format json` prints. Stable: later versions only add fields. */
export interface SweepReport {
  file: string;
  directed: boolean;
  weights: "distance" | "similarity";
  nodes: number;
  /** Thresholds in weight units, in the order edges enter. */
  thresholds: number[];
  /** counts[t][k] = number of k-simplices at thresholds[t]. */
  counts: number[][];
  euler: number[];
  /** Edge density at each threshold. */
  density: number[];
  truncated: boolean;
  /** betti[t][k] = k-th Betti number over Z/prime at thresholds[t], from the barcode; null when not computed. */
  betti: number[][] | null;
  prime: number;
}

const DEFAULT_STEPS = 20;

export function sweepCommand(): Command {
  const command = new Command("sweep")
    .summary("simplex counts, Euler characteristic and Betti numbers across a grid of thresholds")
    .description(
      "Counts the simplices of one graph's complex at every threshold of a grid in a single enumeration, and " +
        "prints the Euler characteristic and the Betti numbers over Z/p (from the barcode) at each threshold. " +
        `Default grid: ${DEFAULT_STEPS} evenly spaced weights from the first edge to enter to the last; with ` +
        "--spec, the grid of that extract run, so the output equals the graph's row of its features.csv.",
    )
    .argument("<file>", GRAPH_FILE_HELP);
  addGraphOptions(command);
  addSpecOption(command);
  addGridOptions(command);
  addComplexOptions(command);
  addOutputOptions(command);
  command.addHelpText(
    "after",
    `
Examples:
  cliquescape sweep demo-data/graphs/ring01u.csv --top-dim 3
  cliquescape sweep subject07.csv --density 0.05,0.1,0.15,0.2 --format csv > s07-sweep.csv
  cliquescape sweep distances.tsv --weights distance --range 0:2.5 --steps 50 --format json`,
  );
  command.action((file: string, raw: Record<string, unknown>, self: Command) => {
    const given = (name: string) => self.getOptionValueSource(name) === "cli";
    const spec = specOf(raw);
    const graphOptions = graphOptionsOf(raw, spec, given);
    const weights = graphOptions.preparation.weights;
    const { graph } = loadGraph(file, graphOptions);
    const grid = gridOf(graph, weights, gridChoiceOf(raw, spec, given), DEFAULT_STEPS);
    const limits = complexOptionsOf(raw, spec, given);
    // Betti numbers at the grid's thresholds need only the filtration up to its end (far less work on dense
    // graphs, and what an extract run with barcodeRange "axis" computes).
    const last = grid.thresholds[grid.thresholds.length - 1];
    const upToGridEnd = grid.thresholds.length > 0 ? thresholdSubgraph(graph, last, weights) : graph;
    const work = startGraphWork(file, limits.timeLimitSeconds);
    const { result, barcode } = (() => {
      try {
        return {
          result: sweepSimplexCounts(graph, grid, {
            ...work.control,
            maxDim: limits.topDim,
            budget: limits.budget,
          }),
          barcode: barcodeWithinBudget(upToGridEnd, weights, limits, work.control),
        };
      } finally {
        work.stop();
      }
    })();
    const possible = possibleEdgeCount(graph.n, graph.directed);
    const counts = result.counts.map((row) => Array.from(row));
    const report: SweepReport = {
      file,
      directed: graph.directed,
      weights,
      nodes: graph.n,
      thresholds: Array.from(result.thresholds),
      counts,
      euler: Array.from(result.euler),
      // From the graph, not from the counts: --top-dim 0 counts no edges.
      density: edgesAt(graph, grid).map((edges) => (possible === 0 ? 0 : edges / possible)),
      truncated: result.truncated,
      betti: barcode && bettiCurves(barcode, grid).map((row) => Array.from(row)),
      prime: limits.prime,
    };
    process.stdout.write(renderSweep(report, raw.format as OutputFormat));
  });
  return command;
}

export function renderSweep(report: SweepReport, format: OutputFormat): string {
  if (format === "json") return `${JSON.stringify(report)}\n`;
  const top = report.counts.reduce((most, row) => Math.max(most, row.length - 1), 0);
  const dims = Array.from({ length: top + 1 }, (_, k) => k);
  const cell = (row: number[], k: number) => row[k] ?? 0;
  const betti = report.betti;
  const bettiDims = betti ? Array.from({ length: betti[0]?.length ?? 0 }, (_, k) => k) : [];
  if (format === "csv") {
    return encodeCsv(
      [
        "threshold",
        "density",
        ...dims.map((k) => `simplices_${k}`),
        "euler",
        ...bettiDims.map((k) => `betti_${k}`),
      ],
      report.thresholds.map((t, i) => [
        t,
        report.density[i],
        ...dims.map((k) => cell(report.counts[i], k)),
        report.euler[i],
        ...bettiDims.map((k) => betti![i][k]),
      ]),
    );
  }
  const relation = report.weights === "similarity" ? "w ≥" : "w ≤";
  const table = textTable(
    [relation, "density", ...dims.map((k) => `dim ${k}`), "euler", ...bettiDims.map((k) => `β${k}`)],
    report.thresholds.map((t, i) => [
      formatWeight(t),
      report.density[i].toFixed(4),
      ...dims.map((k) => formatCount(cell(report.counts[i], k))),
      String(report.euler[i]),
      ...bettiDims.map((k) => String(betti![i][k])),
    ]),
  );
  const notes = [
    `dim k: k-simplices${betti ? `; βk: Betti numbers over Z/${report.prime}` : ""}`,
    ...(report.truncated ? ["euler is partial: --top-dim hid higher simplices"] : []),
  ];
  const note = `\n${notes.join("\n")}`;
  return `${table}${note}\n`;
}

/** Edges present at each threshold of the grid (arcs for a directed graph). */
function edgesAt(graph: WeightedGraph, grid: ThresholdGrid): number[] {
  const bins = edgeBins(edgeFiltration(graph, grid.semantics), gridFiltrationValues(grid));
  const entering = new Array<number>(grid.thresholds.length).fill(0);
  for (const bin of bins) if (bin >= 0) entering[bin]++;
  // Undirected edges are stored in both rows.
  const slotsPerEdge = graph.directed ? 1 : 2;
  let total = 0;
  return entering.map((count) => {
    total += count;
    return total / slotsPerEdge;
  });
}

import {
  allEdgesGrid,
  axisGrid,
  type Barcode,
  computeBarcode,
  mostPersistentBars,
  nodeLabel,
  representativeCycle,
  thresholdSubgraph,
  type WeightedGraph,
} from "@cliquescape/core";
import { encodeCsv } from "@cliquescape/io";
import { Command, Option } from "commander";
import { loadGraph } from "../load-graph.js";
import { addComplexOptions, complexOptionsOf, homologyDimOf } from "../options/complex-options.js";
import {
  addGraphOptions,
  GRAPH_FILE_HELP,
  graphOptionsOf,
  nonNegativeInteger,
  UsageError,
} from "../options/graph-options.js";
import { addOutputOptions, type OutputFormat } from "../options/output-options.js";
import { addSpecOption, specOf } from "../options/spec-option.js";
import { specAxis } from "../options/threshold-options.js";
import { renderBarcodeTable } from "../render/barcode-table.js";
import { startGraphWork } from "../work-progress.js";

/** One bar as `barcode --format json` prints it. Stable: later versions only add fields. */
export interface BarReport {
  dim: number;
  birth: number;
  /** null for an essential class, which never dies. */
  death: number | null;
  /** With --cycles, for dimension-1 bars: the loop as [u, v] pairs of node labels. */
  cycle?: [string, string][];
}

export interface BarcodeReport {
  file: string;
  directed: boolean;
  weights: "distance" | "similarity";
  prime: number;
  /** Threshold at which every vertex is born. */
  start: number;
  /** Threshold at which every edge is in: the right end of the filtration. */
  end: number;
  bars: BarReport[];
}

export function barcodeCommand(): Command {
  const command = new Command("barcode")
    .summary("persistence barcode of the weight filtration, with representative loops")
    .description(
      "Computes the persistence barcode of the clique complex (or directed flag complex) as edges enter by " +
        "weight, in dimensions 0 .. top-dim − 1, over Z/p. Bars are in weight units; essential bars have no " +
        "death. With --spec, the barcode an extract run wrote for the graph (up to the grid's end when the run's " +
        "barcodeRange is axis).",
    )
    .argument("<file>", GRAPH_FILE_HELP);
  addGraphOptions(command);
  addSpecOption(command);
  addComplexOptions(command);
  command
    .addOption(
      new Option(
        "--cycles <k>",
        "add a representative loop to the k most persistent dimension-1 bars ('all': every one)",
      ).argParser((text) => (text === "all" ? Infinity : nonNegativeInteger(text))),
    )
    .addOption(
      new Option("--bar <i>", "add the loop of bar number i only (its index in the output)").argParser(
        nonNegativeInteger,
      ),
    )
    .addOption(new Option("--keep-zero", "keep bars that are born and die at the same weight"));
  addOutputOptions(command);
  command.addHelpText(
    "after",
    `
Examples:
  cliquescape barcode demo-data/graphs/ring01u.csv
  cliquescape barcode demo-data/graphs/ring01u.csv --top-dim 2 --cycles 3 --format json
  cliquescape barcode distances.csv --weights distance --prime 3`,
  );
  command.action((file: string, raw: Record<string, unknown>, self: Command) => {
    const given = (name: string) => self.getOptionValueSource(name) === "cli";
    const spec = specOf(raw);
    const graphOptions = graphOptionsOf(raw, spec, given);
    const weights = graphOptions.preparation.weights;
    const limits = complexOptionsOf(raw, spec, given);
    const maxDim = homologyDimOf(limits);
    if (maxDim < 0) throw new UsageError("--top-dim 0 leaves no homology to compute; use 1 or more");
    const { graph: whole } = loadGraph(file, graphOptions);
    // An extract run's barcode with barcodeRange "axis" covers the filtration up to the grid's end.
    const axis = spec && limits.barcodeRange === "axis" ? specAxis(spec) : undefined;
    const end = axis ? axisGrid(whole, axis, weights).thresholds.at(-1) : undefined;
    const graph = end === undefined ? whole : thresholdSubgraph(whole, end, weights);
    const work = startGraphWork(file, limits.timeLimitSeconds);
    let barcode: Barcode;
    try {
      barcode = computeBarcode(graph, {
        ...work.control,
        semantics: weights,
        maxDim,
        prime: limits.prime,
        budget: { maxBytes: limits.memoryBytes },
        maxSimplices: limits.budget,
        keepZeroLength: Boolean(raw.keepZero),
      });
    } finally {
      work.stop();
    }
    const withCycles = barsWithCycles(
      barcode,
      raw.cycles as number | undefined,
      raw.bar as number | undefined,
    );
    const report: BarcodeReport = {
      file,
      directed: graph.directed,
      weights,
      prime: barcode.prime,
      start: barcode.start,
      end: end ?? allEdgesGrid(graph, weights).thresholds[0],
      bars: barcode.bars.map((bar, i) => ({
        dim: bar.dim,
        birth: bar.birth,
        death: bar.death,
        ...(withCycles.has(i) ? { cycle: loopOf(graph, barcode, i) } : {}),
      })),
    };
    process.stdout.write(renderBarcode(report, raw.format as OutputFormat));
  });
  return command;
}

function barsWithCycles(barcode: Barcode, top: number | undefined, one: number | undefined): Set<number> {
  if (one !== undefined) {
    const bar = barcode.bars[one];
    if (!bar)
      throw new UsageError(
        `--bar ${one}: the barcode has ${barcode.bars.length} bars (0 .. ${barcode.bars.length - 1})`,
      );
    if (bar.dim !== 1)
      throw new UsageError(`--bar ${one} has dimension ${bar.dim}; loops are drawn for dimension-1 bars`);
    return new Set([one]);
  }
  if (top === undefined) return new Set();
  return new Set(mostPersistentBars(barcode, 1, Math.min(top, barcode.bars.length)));
}

function loopOf(graph: WeightedGraph, barcode: Barcode, index: number): [string, string][] {
  const pairs = representativeCycle(graph, barcode, index);
  const loop: [string, string][] = [];
  for (let i = 0; i < pairs.length; i += 2)
    loop.push([nodeLabel(graph, pairs[i]), nodeLabel(graph, pairs[i + 1])]);
  return loop;
}

export function renderBarcode(report: BarcodeReport, format: OutputFormat): string {
  if (format === "json") {
    // One bar per line: long barcodes stay readable and diff well.
    const { bars, ...head } = report;
    const lines = bars.map((bar) => `    ${JSON.stringify(bar)}`).join(",\n");
    const fields = JSON.stringify(head, null, 2).slice(0, -2);
    return `${fields},\n  "bars": [\n${lines}\n  ]\n}\n`;
  }
  if (format === "csv") {
    return encodeCsv(
      ["bar", "dim", "birth", "death", "cycle"],
      report.bars.map((bar, i) => [
        i,
        bar.dim,
        bar.birth,
        bar.death ?? "",
        bar.cycle ? bar.cycle.map(([u, v]) => `${u}-${v}`).join(" ") : "",
      ]),
    );
  }
  return renderBarcodeTable(report);
}

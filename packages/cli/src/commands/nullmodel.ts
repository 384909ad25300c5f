import { availableParallelism } from "node:os";
import {
  compareSampleTable,
  densityGrid,
  NULL_MODELS,
  type NullComparison,
  type NullModel,
  nullFeatureNames,
  nullFeatures,
  rewiringStrata,
} from "@cliquescape/core";
import { encodeCsv } from "@cliquescape/io";
import { Command, Option } from "commander";
import { runAsyncAction } from "../async-action.js";
import { startProgress } from "../extract/progress.js";
import { loadGraph } from "../load-graph.js";
import { type NullReply, type NullSetup, type NullTask, nullBlock } from "../nullmodel/null-worker.js";
import { addComplexOptions, complexOptionsOf } from "../options/complex-options.js";
import {
  addGraphOptions,
  finiteNumber,
  GRAPH_FILE_HELP,
  graphOptionsOf,
  nonNegativeInteger,
  UsageError,
} from "../options/graph-options.js";
import { addOutputOptions, type OutputFormat } from "../options/output-options.js";
import { addSingleThresholdOptions, gridOf } from "../options/threshold-options.js";
import { mapOnWorkers } from "../parallel/map-on-workers.js";
import { formatWeight } from "../render/format-number.js";
import { textTable } from "../render/text-table.js";

/** One feature of `nullmodel --format json`. Stable: later versions only add fields. */
export interface NullFeatureReport extends NullComparison {
  name: string;
}

/** The JSON object `nullmodel --format json` prints. Stable: later versions only add fields. */
export interface NullModelReport {
  file: string;
  directed: boolean;
  weights: "distance" | "similarity";
  model: NullModel;
  seed: number;
  samples: number;
  /** Where counts and Betti numbers are read; null: every edge. */
  threshold: number | null;
  /** The thresholds Betti-curve areas are taken over. */
  grid: number[];
  /** Rewiring only: swaps done and refused over all samples. */
  swaps: { done: number; refused: number } | null;
  features: NullFeatureReport[];
}

const DEFAULT_STEPS = 20;
const DEFAULT_TOP_DIM = 3;
const SAMPLES_PER_TASK = 4;

export function nullmodelCommand(): Command {
  const command = new Command("nullmodel")
    .summary("compare a graph's counts and Betti numbers with a null model: z-scores and p-values")
    .description(
      "Draws N seeded samples of a null model of one graph and compares simplex counts and Betti numbers at a " +
        "threshold, and the areas under the Betti curves, with them: null mean, sd, z-score, empirical p-values.",
    )
    .argument("<file>", GRAPH_FILE_HELP);
  addGraphOptions(command);
  addSingleThresholdOptions(command);
  addComplexOptions(command);
  command
    .addOption(new Option("--model <model>", "null model").choices([...NULL_MODELS]).makeOptionMandatory())
    .addOption(new Option("--samples <n>", "number of null samples").argParser(positive).default(100))
    .addOption(
      new Option("--seed <s>", "random seed; the same seed gives the same samples")
        .argParser(nonNegativeInteger)
        .default(1),
    )
    .addOption(
      new Option("--steps <n>", "thresholds of the grid Betti-curve areas are taken over").argParser(
        positive,
      ),
    )
    .addOption(
      new Option("--range <from:to>", "weights the grid spans (default: all edges)").argParser(parseRange),
    )
    .addOption(
      new Option("--swaps-per-edge <k>", "rewire: swap attempts per edge")
        .argParser(finiteNumber)
        .default(10),
    )
    .addOption(new Option("--workers <n>", "worker threads (default: all cores)").argParser(positive));
  addOutputOptions(command);
  command.addHelpText(
    "after",
    `
Models (--model):
  er       Erdős–Rényi: same nodes and density, weights drawn from the graph's
  rewire   degree-preserving edge swaps (directed: in- and out-degrees kept), degrees kept at every threshold
  shuffle  the same edges with their weights permuted

Examples:
  cliquescape nullmodel demo-data/graphs/ring01u.csv --model rewire --samples 200 --density 0.1
  cliquescape nullmodel subject07.csv --model er --samples 500 --threshold 0.4 --format csv
  cliquescape nullmodel net.tsv --model shuffle --samples 100 --seed 7 --format json`,
  );
  command.action((file: string, raw: Record<string, unknown>) =>
    runAsyncAction(() => nullmodelAction(file, raw)),
  );
  return command;
}

async function nullmodelAction(file: string, raw: Record<string, unknown>): Promise<void> {
  {
    const graphOptions = graphOptionsOf(raw);
    const semantics = graphOptions.preparation.weights;
    const limits = complexOptionsOf(raw);
    const topDim = limits.topDim ?? DEFAULT_TOP_DIM;
    if (topDim < 1) throw new UsageError("--top-dim must be at least 1");
    const { graph } = loadGraph(file, graphOptions);
    const threshold = thresholdOf(raw, graph, semantics);
    const grid = gridOf(
      graph,
      semantics,
      { steps: raw.steps as number | undefined, range: raw.range as [number, number] | undefined },
      DEFAULT_STEPS,
    );
    const model = raw.model as NullModel;
    const samples = raw.samples as number;
    const seed = raw.seed as number;
    const swapsPerEdge = raw.swapsPerEdge as number;
    if (!(swapsPerEdge >= 0)) throw new UsageError("--swaps-per-edge must be ≥ 0");
    const setup: NullSetup = {
      graph: {
        n: graph.n,
        directed: graph.directed,
        offsets: graph.offsets,
        targets: graph.targets,
        weights: graph.weights,
      },
      sampling: {
        model,
        seed,
        swapsPerEdge,
        // Rewiring keeps degrees among the edges entering between the same two thresholds.
        grid: rewiringStrata(grid, threshold),
      },
      features: {
        semantics,
        threshold,
        grid,
        topDim,
        prime: limits.prime,
        countBudget: limits.budget,
        homologyBudget: limits.memoryBytes === undefined ? undefined : { maxBytes: limits.memoryBytes },
      },
    };
    const names = nullFeatureNames(topDim);
    const observed = nullFeatures(graph, setup.features);
    const values = new Float64Array(samples * names.length);
    const tasks: NullTask[] = [];
    for (let from = 0; from < samples; from += SAMPLES_PER_TASK)
      tasks.push({ from, to: Math.min(samples, from + SAMPLES_PER_TASK) });
    const workers = (raw.workers as number | undefined) ?? availableParallelism();
    const progress = startProgress("null model", samples, process.stderr, "samples");
    let done = 0;
    let swaps = 0;
    let refused = 0;
    const take = (reply: NullReply) => {
      values.set(reply.values, reply.from * names.length);
      swaps += reply.swaps;
      refused += reply.refused;
      done += reply.values.length / names.length;
      progress.update(done, 0);
    };
    if (workers <= 1) for (const task of tasks) take(nullBlock(setup, task));
    else
      await mapOnWorkers<NullTask, NullReply>(
        new URL("../nullmodel/null-worker.js", import.meta.url),
        setup,
        tasks,
        workers,
        take,
      );
    progress.stop();

    const features = compareSampleTable(observed, values).map((c, f) => ({ name: names[f], ...c }));
    const report: NullModelReport = {
      file,
      directed: graph.directed,
      weights: semantics,
      model,
      seed,
      samples,
      threshold: threshold ?? null,
      grid: Array.from(grid.thresholds),
      swaps: model === "rewire" ? { done: swaps, refused } : null,
      features,
    };
    process.stdout.write(renderNullModel(report, raw.format as OutputFormat));
  }
}

export function renderNullModel(report: NullModelReport, format: OutputFormat): string {
  if (format === "json") return `${JSON.stringify(report, null, 2)}\n`;
  const columns = [
    "feature",
    "observed",
    "null_mean",
    "null_sd",
    "z",
    "p_greater",
    "p_less",
    "p_two_sided",
    "samples",
  ];
  const rows = report.features.map((f) => [
    f.name,
    f.observed,
    f.mean,
    f.sd,
    f.z ?? "",
    f.pGreater,
    f.pLess,
    f.pTwoSided,
    f.samples,
  ]);
  if (format === "csv") return encodeCsv(columns, rows);
  const at =
    report.threshold === null
      ? "every edge"
      : `${report.weights === "similarity" ? "w ≥" : "w ≤"} ${formatWeight(report.threshold)}`;
  const table = textTable(
    ["feature", "observed", "null mean", "null sd", "z", "p (two-sided)"],
    report.features.map((f) => [
      f.name,
      formatWeight(f.observed),
      formatWeight(f.mean),
      formatWeight(f.sd),
      f.z === null ? "–" : f.z.toFixed(2),
      f.pTwoSided.toPrecision(3),
    ]),
  );
  const swaps = report.swaps ? `; ${report.swaps.done} swaps done, ${report.swaps.refused} refused` : "";
  return (
    `${report.file}: ${report.model} null model, ${report.samples} samples (seed ${report.seed})${swaps}\n` +
    `counts and Betti numbers at ${at}; areas over ${report.grid.length} thresholds\n\n${table}\n` +
    `z: (observed − null mean) / null sd, "–" when every sample is equal; p: (1 + samples at least as extreme) / (N + 1)\n`
  );
}

function thresholdOf(
  raw: Record<string, unknown>,
  graph: Parameters<typeof densityGrid>[0],
  semantics: "distance" | "similarity",
): number | undefined {
  const t = raw.threshold as number[] | undefined;
  const d = raw.density as number[] | undefined;
  if (t) return t[0];
  if (d) {
    if (!(d[0] >= 0 && d[0] <= 1)) throw new UsageError(`density ${d[0]} is not in 0..1`);
    return densityGrid(graph, d, semantics).thresholds[0];
  }
  return undefined;
}

function positive(text: string): number {
  const value = nonNegativeInteger(text);
  if (value < 1) throw new UsageError(`expected a whole number ≥ 1, got "${text}"`);
  return value;
}

function parseRange(text: string): [number, number] {
  const parts = text.split(":");
  if (parts.length !== 2) throw new UsageError(`expected FROM:TO, got "${text}"`);
  return [finiteNumber(parts[0]), finiteNumber(parts[1])];
}

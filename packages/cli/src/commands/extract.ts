import { availableParallelism } from "node:os";
import { NULL_MODELS, NULL_SCORE_FEATURES } from "@cliquescape/core";
import { Command, Option } from "commander";
import { cliMessage } from "../cli-message.js";
import { exitCodeFor } from "../exit-codes.js";
import { InterruptedError } from "../extract/interrupted-error.js";
import { optionsToSpec } from "../extract/options-to-spec.js";
import { runExtract } from "../extract/run-extract.js";
import { runPlan } from "../extract/run-plan.js";
import { runShard } from "../extract/run-shard.js";
import { EDGE_TRANSFORMS } from "../extract/run-spec.js";
import { parseShard } from "../extract/shard-plan.js";
import { timeLimitOption } from "../options/complex-options.js";
import { addConnectivityOptions } from "../options/connectivity-options.js";
import {
  finiteNumber,
  nonNegativeInteger,
  numberList,
  positiveInteger,
  UsageError,
} from "../options/graph-options.js";

export function extractCommand(): Command {
  const command = new Command("extract")
    .summary("a whole dataset in, topological features for statistics and GNNs out")
    .description(
      "Reads every graph of a dataset (a manifest CSV with id, file, label, split columns, a folder of graph " +
        "files, or a stack of matrices), prepares them all the same way, reads their topology on one grid of " +
        "thresholds shared by the whole dataset, and writes a run folder: feature tables (CSV, NPZ), per-graph " +
        "barcodes and GNN bundles, errors.csv and spec.json. Graphs run in parallel on worker threads. Running " +
        "the same command again skips finished graphs; Ctrl-C keeps every finished graph. Settings come from " +
        "--spec (a JSON file, e.g. a previous run's spec.json) with the options below laid over it; see " +
        "docs/extract.md. Graph files read: dense matrices and edge lists (.csv .tsv .txt), NumPy (.npy .npz), " +
        "MATLAB (.mat), GraphML (.graphml) and GEXF (.gexf). With --measure the dataset holds recordings (time " +
        "series) instead of matrices: each becomes a connectivity matrix first (docs/connectivity.md).",
    )
    .argument(
      "<dataset>",
      "manifest CSV/TSV (id,file[,label,split,directed,coords,…]), folder of graph files (or holding one manifest), or stack (.npy .npz .mat)",
    )
    .requiredOption(
      "--out <dir>",
      "run folder to write (created, or an empty folder; a run folder of ours is resumed, any other folder refused)",
    )
    .addOption(new Option("--spec <file>", "run spec JSON: a partial one, or a previous run's spec.json"))
    .addOption(
      new Option(
        "--labels <file>",
        "for a stack: one label per line in slice order, or a table with a header (id,label, or a participants table): the stack's ids, or your own ids naming the slices in order",
      ),
    )
    .addOption(
      new Option("--labels-column <name>", "the column of --labels holding the labels (default: label)"),
    )
    .addOption(
      new Option("--coordinates <file>", "node coordinates CSV (node,x,y[,z]) for graphs without their own"),
    )
    .addOption(new Option("--variable <name>", "for a .npz or .mat stack: the array or variable to read"))
    .addOption(
      new Option("--workers <n>", "worker threads")
        .argParser(positiveInteger)
        .default(availableParallelism(), "all cores"),
    )
    // Preparation. No defaults here: unset options leave the spec file's setting (or the spec default).
    .addOption(
      new Option("--directed", "read every graph as directed (default: the manifest's directed column)"),
    )
    .addOption(new Option("--undirected", "read every graph as undirected"))
    .addOption(
      new Option("--weights <meaning>", "what weights mean after --transform (default similarity)").choices([
        "similarity",
        "distance",
      ]),
    )
    .addOption(
      new Option(
        "--symmetrize <how>",
        "merge a_ij and a_ji of a matrix read as undirected when they differ by more than a relative 1e-9 (closer values are one weight, their mean); default error: refuse the graph",
      ).choices(["error", "max", "min", "mean"]),
    )
    .addOption(
      new Option(
        "--negatives <how>",
        "negative weights: auto (default) drops negative similarities, as 0 is no edge, and refuses negative distances; or refuse, absolute value, drop the edge, keep",
      ).choices(["auto", "error", "abs", "drop", "keep"]),
    )
    .addOption(
      new Option(
        "--zero-edges [rule]",
        "is a 0 read from a file an edge? auto (default): not for similarities, yes for distances; the option alone: edge",
      )
        .choices(["auto", "edge", "no-edge"])
        .preset("edge"),
    )
    .addOption(
      new Option(
        "--nan-cells <rule>",
        "NaN weights (corrcoef of a constant signal): no edge (default), or refuse the graph",
      ).choices(["no-edge", "error"]),
    )
    .addOption(
      new Option("--max-nodes <n>", "largest matrix read, in nodes (default 8192)").argParser(
        positiveInteger,
      ),
    )
    .addOption(
      new Option(
        "--max-file <MiB>",
        "largest graph file read (default: 256 for text, 2048 for .npy .npz .mat)",
      ).argParser(positiveInteger),
    )
    .addOption(
      new Option("--transform <f>", "edge-value transform before the semantics: 1−w, −log w, 1/w").choices([
        ...EDGE_TRANSFORMS,
      ]),
    )
    // Complex.
    .addOption(
      new Option("--top-dim <k>", "count simplices to dimension k; homology to k−1 (default 3)").argParser(
        positiveInteger,
      ),
    )
    .addOption(new Option("--prime <p>", "homology coefficients Z/p (default 2)").argParser(positiveInteger))
    .addOption(
      new Option("--budget <n>", "simplices one graph may enumerate (default: the core's)").argParser(
        positiveInteger,
      ),
    )
    .addOption(
      new Option("--memory <MiB>", "memory the homology of one graph may hold (default 1024)").argParser(
        positiveInteger,
      ),
    )
    .addOption(
      new Option(
        "--barcode-range <r>",
        "barcode up to the grid's end (axis, default) or of the whole filtration",
      ).choices(["axis", "full"]),
    )
    .addOption(timeLimitOption(false))
    // Grid.
    .addOption(
      new Option("--threshold <list>", "grid of these weights (comma-separated)").argParser(numberList),
    )
    .addOption(
      new Option("--density <list>", "grid of these edge densities, 0..1 (comma-separated)").argParser(
        numberList,
      ),
    )
    .addOption(
      new Option("--steps <n>", "quantile grid: number of thresholds (default 20)").argParser(
        positiveInteger,
      ),
    )
    .addOption(
      new Option(
        "--quantiles <from:to>",
        "quantile grid: dataset weight quantiles it spans (default 0.05:0.95)",
      ).argParser(quantilePair),
    )
    // Node and edge features.
    .addOption(
      new Option("--node-threshold <w>", "node/edge features at this weight").argParser(finiteNumber),
    )
    .addOption(
      new Option("--node-density <d>", "node/edge features at this edge density (default 0.1)").argParser(
        finiteNumber,
      ),
    )
    .addOption(new Option("--node-all-edges", "node/edge features with every edge"))
    // Families and outputs.
    .addOption(
      new Option(
        "--families <list>",
        "feature families, comma-separated (default: simplexCounts,euler,betti,curveSummaries,barcodeSummaries,network; also landscapes,images,entropy,persistenceCurves)",
      ).argParser((text) => text.split(",").map((s) => s.trim())),
    )
    // z-scored columns against a null model.
    .addOption(
      new Option(
        "--null-model <model>",
        "add z-scored columns against this null model (none: no z columns; see docs/null-models.md)",
      ).choices([...NULL_MODELS, "none"]),
    )
    .addOption(
      new Option("--null-samples <n>", "null samples per graph for the z columns (default 100)").argParser(
        positiveInteger,
      ),
    )
    .addOption(
      new Option("--null-seed <s>", "seed of the null samples (default 1)").argParser(nonNegativeInteger),
    )
    .addOption(
      new Option(
        "--null-features <list>",
        `features that get a z column, comma-separated (default: ${NULL_SCORE_FEATURES.join(",")})`,
      ).argParser((text) => text.split(",").map((s) => s.trim())),
    )
    // Sharded runs (docs/cluster.md).
    .addOption(
      new Option(
        "--plan",
        "write spec.json (grid included) and plan.json (every graph's estimated cost) into --out and stop: the first step of a sharded run",
      ).conflicts("shard"),
    )
    .addOption(
      new Option(
        "--shard <I/N>",
        "compute shard I of N (I counts from 0) of a planned run into OUT/parts/I-of-N; then cliquescape merge OUT",
      ).argParser(shardArgument),
    )
    .addOption(new Option("--no-bundles", "do not write GNN bundles"))
    .addOption(new Option("--no-barcodes", "do not write barcodes"));
  // Recordings instead of matrices (recorded in the spec's connectivity section).
  addConnectivityOptions(command);
  command.addHelpText(
    "after",
    `
Examples:
  cliquescape extract demo-data/manifest.csv --out out/demo
  cliquescape extract demo-data/recordings/manifest.csv --out out/rec --measure coactivity --window 2 --negatives drop
  cliquescape extract scans/ --out runs/a --weights distance --transform one-minus --top-dim 2
  cliquescape extract new-subjects.csv --out runs/b --spec runs/a/spec.json
  cliquescape extract cohort.npy --labels participants.tsv --labels-column group --out runs/c
  cliquescape extract demo-data/manifest.csv --out out/z --null-model rewire --null-samples 200
  cliquescape extract demo-data/manifest.csv --out out/big --plan            # then, for I in 0..3:
  cliquescape extract demo-data/manifest.csv --out out/big --spec out/big/spec.json --shard I/4
Exit codes:
  0    every graph is in the tables (--plan: planned; --shard: the shard finished, failed graphs included)
  1    some graph was left out (see errors.csv), or no graph could be read
  2    bad command line or spec, the run folder holds results made under other settings, or --out holds
       files that are not a cliquescape run folder, or is the dataset's folder
  74   a write failed: disk full, read-only, no permission, --out is a file (finished graphs kept)
  75   another run is working in the same --out folder (it holds run.lock)
  130  interrupted (finished graphs kept)`,
  );
  command.action((dataset: string, raw: Record<string, unknown>, self: Command) => {
    const given = (name: string) => self.getOptionValueSource(name) === "cli";
    // The job is asynchronous (worker threads); its outcome sets the exit code when it settles.
    void extractAction(dataset, raw, given);
  });
  return command;
}

async function extractAction(
  dataset: string,
  raw: Record<string, unknown>,
  given: (name: string) => boolean,
): Promise<void> {
  const controller = new AbortController();
  let interrupts = 0;
  const onInterrupt = () => {
    interrupts++;
    if (interrupts > 1) process.exit(130); // a second Ctrl-C: the user insists; every finished file is whole
    process.stderr.write("\ncliquescape: interrupted: finishing the tables from the graphs done so far\n");
    controller.abort();
  };
  process.on("SIGINT", onInterrupt);
  try {
    const { spec, source } = optionsToSpec(raw, given);
    const request = {
      dataset,
      out: raw.out as string,
      workers: raw.workers as number,
      spec,
      specSource: source,
      datasetOptions: {
        labelsFile: raw.labels as string | undefined,
        labelsColumn: raw.labelsColumn as string | undefined,
        coordinatesFile: raw.coordinates as string | undefined,
        variable: raw.variable as string | undefined,
      },
      signal: controller.signal,
    };
    if (raw.plan) {
      await runPlan(request);
      process.exitCode = 0;
      return;
    }
    const shard = raw.shard as { index: number; count: number } | undefined;
    // A scheduler stops a job with SIGTERM (scancel, time limit): a shard ends as on Ctrl-C.
    if (shard) process.on("SIGTERM", onInterrupt);
    const result = shard ? await runShard(request, shard) : await runExtract(request);
    process.exitCode = result.exitCode;
  } catch (error) {
    if (error instanceof InterruptedError) {
      process.stderr.write(`cliquescape: ${error.message}\n`);
      process.exitCode = 130;
      return;
    }
    const message = error instanceof Error ? error.message : String(error);
    process.stderr.write(`cliquescape: ${cliMessage(message)}\n`);
    process.exitCode = exitCodeFor(error);
  } finally {
    process.off("SIGINT", onInterrupt);
    process.off("SIGTERM", onInterrupt);
  }
}

function quantilePair(text: string): [number, number] {
  const parts = text.split(":");
  if (parts.length !== 2) throw new UsageError(`expected FROM:TO quantiles, got "${text}"`);
  return [finiteNumber(parts[0]), finiteNumber(parts[1])];
}

function shardArgument(text: string): { index: number; count: number } {
  try {
    return parseShard(text);
  } catch (error) {
    throw new UsageError((error as Error).message);
  }
}

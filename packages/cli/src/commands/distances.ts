import { mkdirSync } from "node:fs";
import { availableParallelism } from "node:os";
import { join } from "node:path";
import { encodeCsv, writeFileAtomic, writeNpyFile } from "@cliquescape/io";
import { Command, Option } from "commander";
import { runAsyncAction } from "../async-action.js";
import {
  type DistanceReply,
  type DistanceSetup,
  type DistanceTask,
  distanceRow,
} from "../distances/distance-worker.js";
import { type EssentialChoice, runDiagrams } from "../distances/run-diagrams.js";
import { startProgress } from "../extract/progress.js";
import { finiteNumber, nonNegativeInteger, UsageError } from "../options/graph-options.js";
import { mapOnWorkers } from "../parallel/map-on-workers.js";

export function distancesCommand(): Command {
  const command = new Command("distances")
    .summary("pairwise bottleneck or Wasserstein distances between the barcodes of an extract run")
    .description(
      "Reads the barcodes of a finished `extract` run folder and writes the matrix of distances between every " +
        "two graphs' persistence diagrams of one homology dimension, as CSV (ids in the header and first column) " +
        "and NumPy .npy (float64, rows in the order of features.csv). Exact; computed on worker threads.",
    )
    .argument("<run-dir>", "an extract run folder (with features.csv and barcodes/)")
    .addOption(new Option("--dim <k>", "homology dimension").argParser(nonNegativeInteger).default(1))
    .addOption(
      new Option("--metric <metric>", "which distance")
        .choices(["wasserstein", "bottleneck"])
        .default("wasserstein"),
    )
    .addOption(
      new Option("--p <p>", "order of the Wasserstein distance (≥ 1)").argParser(finiteNumber).default(1),
    )
    .addOption(
      new Option(
        "--essential <how>",
        "bars that never die: cut at the barcode's end (or --cut-at), drop, or match separately",
      )
        .choices(["cut", "drop", "separate"])
        .default("cut"),
    )
    .addOption(
      new Option("--cut-at <w>", "with --essential cut: end essential bars at this weight").argParser(
        finiteNumber,
      ),
    )
    .addOption(
      new Option(
        "--out <prefix>",
        "output files PREFIX.csv and PREFIX.npy (default RUN_DIR/distances/METRIC-dK)",
      ),
    )
    .addOption(
      new Option("--workers <n>", "worker threads (default: all cores)").argParser(nonNegativeInteger),
    );
  command.addHelpText(
    "after",
    `
Examples:
  cliquescape distances out/demo                      # 1-Wasserstein between H1 diagrams
  cliquescape distances out/demo --metric bottleneck --dim 0 --essential separate
  cliquescape distances runs/a --p 2 --out runs/a/w2-h1`,
  );
  command.action((root: string, raw: Record<string, unknown>) =>
    runAsyncAction(() => distancesAction(root, raw)),
  );
  return command;
}

async function distancesAction(root: string, raw: Record<string, unknown>): Promise<void> {
  const dim = raw.dim as number;
  const metric = raw.metric as "wasserstein" | "bottleneck";
  const p = raw.p as number;
  if (metric === "wasserstein" && !(p >= 1)) throw new UsageError(`--p must be ≥ 1, got ${p}`);
  const essential = raw.essential as EssentialChoice;
  if (raw.cutAt !== undefined && essential !== "cut")
    throw new UsageError("--cut-at goes with --essential cut");
  const { ids, diagrams } = runDiagrams(root, dim, essential, raw.cutAt as number | undefined);
  const n = ids.length;
  const name = `${metric === "bottleneck" ? "bottleneck" : `wasserstein${p}`}-d${dim}`;
  const prefix = (raw.out as string | undefined) ?? join(root, "distances", name);
  mkdirSync(join(prefix, ".."), { recursive: true });

  const setup: DistanceSetup = { diagrams, p: metric === "bottleneck" ? null : p };
  const matrix = new Float64Array(n * n);
  const tasks: DistanceTask[] = Array.from({ length: Math.max(0, n - 1) }, (_, row) => ({ row }));
  const pairs = (n * (n - 1)) / 2;
  const progress = startProgress("distances", pairs, process.stderr, "pairs");
  let done = 0;
  const take = (reply: DistanceReply) => {
    const i = reply.row;
    for (let k = 0; k < reply.values.length; k++) {
      matrix[i * n + i + 1 + k] = reply.values[k];
      matrix[(i + 1 + k) * n + i] = reply.values[k];
    }
    done += reply.values.length;
    progress.update(done, 0);
  };
  const workers = (raw.workers as number | undefined) ?? availableParallelism();
  if (workers <= 1) for (const task of tasks) take(distanceRow(setup, task));
  else
    await mapOnWorkers<DistanceTask, DistanceReply>(
      new URL("../distances/distance-worker.js", import.meta.url),
      setup,
      tasks,
      workers,
      take,
    );
  progress.stop();

  const rows = ids.map((id, i) => [id, ...Array.from(matrix.subarray(i * n, (i + 1) * n))]);
  writeFileAtomic(`${prefix}.csv`, encodeCsv(["id", ...ids], rows));
  writeNpyFile(`${prefix}.npy`, matrix, [n, n]);
  const infinite = matrix.some((x) => x === Infinity);
  process.stdout.write(
    `${n} graphs, ${pairs} pairs: ${name} distances of H${dim} diagrams\n` +
      `wrote ${prefix}.csv and ${prefix}.npy (rows in the order of features.csv)\n` +
      (infinite
        ? "some distances are infinite: those diagrams differ in their number of essential bars\n"
        : ""),
  );
}

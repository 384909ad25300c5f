import { availableParallelism } from "node:os";
import { Command, Option } from "commander";
import { ConnectivitySchema } from "../connect/connectivity-spec.js";
import { type MatrixLayout, runConnect } from "../connect/run-connect.js";
import { exitCodeFor } from "../exit-codes.js";
import {
  addConnectivityOptions,
  connectivityFromOptions,
  inOptionNames,
} from "../options/connectivity-options.js";
import { nonNegativeInteger, UsageError } from "../options/graph-options.js";

export function connectCommand(): Command {
  const command = new Command("connect")
    .summary("recordings (time series) in, connectivity matrices out")
    .description(
      "Reads every recording of a dataset (a folder of recording files, a manifest CSV with id and file " +
        "columns, a 3-D stack of recordings, or one file) — time points × channels in text (.csv .tsv .txt), .npy, " +
        ".npz or .mat — checks each channel (a constant or NaN channel is refused, or isolated with " +
        "--bad-channels isolate), computes the chosen measure on worker threads and writes the matrices: one " +
        "(k, n, n) matrices.npy stack with ids.txt, or one .npy per recording with a manifest.csv that " +
        "`extract` reads. subjects.csv lists every recording with its quality notes, errors.csv the failed " +
        "ones, connect.json the settings and input hashes. See docs/connectivity.md.",
    )
    .argument(
      "<dataset>",
      "folder, manifest CSV/TSV (id,file[,label,split,…]), stack (.npy .npz .mat) or one recording",
    )
    .requiredOption("--out <dir>", "folder to write the matrices and tables to (created)");
  addConnectivityOptions(command);
  command
    .addOption(
      new Option(
        "--layout <how>",
        "one (k, n, n) stack with ids.txt, or one .npy per recording with manifest.csv",
      )
        .choices(["stack", "files"])
        .default("stack"),
    )
    .addOption(new Option("--labels <file>", "for a stack: one label per recording (or a CSV with id,label)"))
    .addOption(new Option("--variable <name>", "for a .npz or .mat file: the array or variable to read"))
    .addOption(
      new Option("--workers <n>", "worker threads")
        .argParser(positive)
        .default(availableParallelism(), "all cores"),
    );
  command.addHelpText(
    "after",
    `
Examples:
  cliquescape connect recordings/ --out conn --measure pearson --fisher-z
  cliquescape connect cohort.npy --out conn --measure partial --labels groups.txt
  cliquescape connect spikes.csv --out conn --measure coactivity --window 2 --layout files
  cliquescape connect eeg/manifest.csv --out conn --measure lagged --max-lag 5 --channels 64
Exit codes: 0 every recording written; 1 some left out (see errors.csv); 2 bad command line, or --out
holds files connect did not write; 3 the stack would not fit in memory (use --layout files); 74 --out
cannot be written; 75 another connect is writing --out; 130 interrupted.`,
  );
  command.action((dataset: string, raw: Record<string, unknown>) => {
    void connectAction(dataset, raw);
  });
  return command;
}

async function connectAction(dataset: string, raw: Record<string, unknown>): Promise<void> {
  const controller = new AbortController();
  const onInterrupt = () => {
    process.stderr.write("\ncliquescape: interrupted: writing the matrices finished so far\n");
    controller.abort();
  };
  process.once("SIGINT", onInterrupt);
  try {
    if (raw.measure === undefined)
      throw new UsageError("--measure is required: pearson, spearman, partial, lagged or coactivity");
    const parsed = ConnectivitySchema.safeParse(connectivityFromOptions(raw));
    if (!parsed.success) {
      throw new UsageError(inOptionNames(parsed.error.issues.map((issue) => issue.message).join("; ")));
    }
    const result = await runConnect({
      dataset,
      out: raw.out as string,
      workers: raw.workers as number,
      connectivity: parsed.data,
      layout: raw.layout as MatrixLayout,
      datasetOptions: {
        labelsFile: raw.labels as string | undefined,
        variable: raw.variable as string | undefined,
      },
      signal: controller.signal,
    });
    process.exitCode = result.exitCode;
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    process.stderr.write(`cliquescape: ${message}\n`);
    process.exitCode = exitCodeFor(error);
  } finally {
    process.off("SIGINT", onInterrupt);
  }
}

function positive(text: string): number {
  const value = nonNegativeInteger(text);
  if (value < 1) throw new UsageError(`expected a whole number ≥ 1, got "${text}"`);
  return value;
}

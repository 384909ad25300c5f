import { Command, Option } from "commander";
import { runAsyncAction } from "../async-action.js";
import { mergeParts } from "../extract/merge-parts.js";
import { positiveInteger } from "../options/graph-options.js";

export function mergeCommand(): Command {
  const command = new Command("merge")
    .summary("combine the shards of a planned extract run into its tables")
    .description(
      "Combines the parts a sharded extract run wrote (OUT/parts/I-of-N, one per `extract --shard I/N`) into " +
        "the run folder: features.csv, features.npz, errors.csv and the per-graph barcodes, bundles and records, " +
        "byte for byte what a single `extract` run writes. Per-graph files are hard-linked (copied where the " +
        "file system has no hard links). When a shard is missing or unfinished, names each one and writes " +
        "nothing. See docs/cluster.md.",
    )
    .argument("<run-dir>", "the run folder given to extract --plan and --shard as --out")
    .addOption(
      new Option(
        "--shards <n>",
        "the shard count N the shards ran with (default: read from the part folders' names)",
      ).argParser(positiveInteger),
    )
    .addHelpText(
      "after",
      `
Examples:
  cliquescape merge out/big
  cliquescape merge out/big --shards 4     # also names shards that never started
Exit codes:
  0    every graph is in the tables
  1    some graph was left out (see errors.csv)
  2    bad command line, or not a planned run folder
  4    a shard is missing or unfinished: nothing written (run it again, then merge)`,
    )
    .action((runDir: string, options: { shards?: number }) => {
      runAsyncAction(async () => {
        const result = await mergeParts(runDir, options.shards);
        process.exitCode = result.exitCode;
      });
    });
  return command;
}

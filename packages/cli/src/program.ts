import { Command } from "commander";
import { barcodeCommand } from "./commands/barcode.js";
import { clusterScriptCommand } from "./commands/cluster-script.js";
import { connectCommand } from "./commands/connect.js";
import { distancesCommand } from "./commands/distances.js";
import { extractCommand } from "./commands/extract.js";
import { inspectCommand } from "./commands/inspect.js";
import { mergeCommand } from "./commands/merge.js";
import { nullmodelCommand } from "./commands/nullmodel.js";
import { reportCommand } from "./commands/report.js";
import { sweepCommand } from "./commands/sweep.js";
import { viewCommand } from "./commands/view.js";
import { VERSION } from "./version.js";

/** The cliquescape command line, without running it (tests build it too). */
export function createProgram(): Command {
  const program = new Command("cliquescape")
    .description(
      "Topology of weighted networks: clique and directed flag complexes across weight thresholds.",
    )
    .version(VERSION)
    .showHelpAfterError("(run with --help for usage)")
    .addCommand(inspectCommand())
    .addCommand(sweepCommand())
    .addCommand(barcodeCommand())
    .addCommand(extractCommand())
    .addCommand(mergeCommand())
    .addCommand(clusterScriptCommand())
    .addCommand(nullmodelCommand())
    .addCommand(distancesCommand())
    .addCommand(connectCommand())
    .addCommand(viewCommand())
    .addCommand(reportCommand());
  program.addHelpText(
    "after",
    `
Examples:
  cliquescape inspect demo-data/graphs/ring01u.csv --threshold 0.5
  cliquescape sweep demo-data/graphs/ring01u.csv --top-dim 3 --format csv`,
  );
  return program;
}

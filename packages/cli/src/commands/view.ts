import type { Server } from "node:http";
import type { AddressInfo } from "node:net";
import { Command, Option } from "commander";
import { addComplexOptions, complexOptionsOf } from "../options/complex-options.js";
import {
  addGraphOptions,
  GRAPH_FILE_HELP,
  graphOptionsOf,
  nonNegativeInteger,
} from "../options/graph-options.js";
import { addSpecOption, specOf } from "../options/spec-option.js";
import { viewerPageHtml } from "../view/page-html.js";
import { LOOPBACK, servePage } from "../view/page-server.js";
import { openViewTarget, type ViewOptions, type ViewTarget } from "../view/view-target.js";

/** Options `view` and `report` share: how to read a single graph file, and where a run's dataset is. */
export function addViewOptions(command: Command): Command {
  addGraphOptions(command);
  addSpecOption(command);
  addComplexOptions(command);
  return command
    .addOption(new Option("--coords <file>", "node positions for a single graph (CSV: node,x,y)"))
    .addOption(
      new Option("--dataset <path>", "a run's dataset, when the path in its spec.json does not lead there"),
    );
}

export function viewOptionsOf(raw: Record<string, unknown>, self: Command): ViewOptions {
  const given = (name: string) => self.getOptionValueSource(name) === "cli";
  const spec = specOf(raw);
  return {
    graph: graphOptionsOf(raw, spec, given),
    complex: complexOptionsOf(raw, spec, given),
    coords: raw.coords as string | undefined,
    dataset: raw.dataset as string | undefined,
  };
}

export function viewCommand(): Command {
  const command = new Command("view")
    .summary("open a graph or a run folder in the browser (served on 127.0.0.1 only)")
    .description(
      "Serves the cliquescape page for one graph file or for a run folder written by extract, on this machine " +
        "only (127.0.0.1), and prints its address. Open it in a browser: the graph at a threshold slider, the " +
        "numbers there, Betti and Euler curves, barcode and diagram; choosing a bar draws its loop on the graph. " +
        "Only what was given is served: no other file, no directory listing. Ctrl-C stops it.",
    )
    .argument("<file>", `${GRAPH_FILE_HELP}; or a run folder written by extract (it holds spec.json)`);
  addViewOptions(command);
  command.addOption(
    new Option("--port <n>", "port to listen on (default: a free one)")
      .argParser(nonNegativeInteger)
      .default(0),
  );
  command.addHelpText(
    "after",
    `
Examples:
  cliquescape view demo-data/graphs/ring01u.csv --coords demo-data/coords/ring01u.csv
  cliquescape view out/demo
  cliquescape view subject07.npy --weights distance --port 8321`,
  );
  command.action((path: string, raw: Record<string, unknown>, self: Command) => {
    // Reading the input is synchronous, so a bad file fails here with the usual message and exit code.
    const target = openViewTarget(path, viewOptionsOf(raw, self));
    const html = viewerPageHtml();
    void serveUntilStopped(path, target, html, raw.port as number);
  });
  return command;
}

async function serveUntilStopped(
  path: string,
  target: ViewTarget,
  html: string,
  port: number,
): Promise<void> {
  let server: Server;
  try {
    server = await servePage(target, html, port);
  } catch (error) {
    process.stderr.write(`cliquescape: cannot listen on ${LOOPBACK}:${port}: ${(error as Error).message}\n`);
    process.exitCode = 2;
    return;
  }
  const stop = () => {
    process.stdout.write("cliquescape view: stopped\n");
    server.closeAllConnections();
    server.close();
  };
  // Ready for Ctrl-C before the address is out: whoever reads it may stop the server at once.
  process.once("SIGINT", stop);
  process.once("SIGTERM", stop);
  const { port: actual } = server.address() as AddressInfo;
  process.stdout.write(`cliquescape view: ${path} at http://${LOOPBACK}:${actual}/  (Ctrl-C to stop)\n`);
}

import { resolve } from "node:path";
import { writeFileAtomic } from "@cliquescape/io";
import { Command } from "commander";
import { GRAPH_FILE_HELP, UsageError } from "../options/graph-options.js";
import { embedData } from "../view/page-data.js";
import { viewerPageHtml } from "../view/page-html.js";
import { openViewTarget } from "../view/view-target.js";
import { addViewOptions, viewOptionsOf } from "./view.js";

export function reportCommand(): Command {
  const command = new Command("report")
    .summary("write a run folder (or one graph) as one self-contained HTML file")
    .description(
      "Writes the cliquescape page with everything inlined — scripts, styles, the run's tables and every " +
        "graph — as one HTML file that opens from disk and makes no network request. A run's report shows its " +
        "table, curves by label and feature map, and opens each graph with its loops, computed in the page.",
    )
    .argument("<file>", `a run folder written by extract (it holds spec.json); or one ${GRAPH_FILE_HELP}`);
  addViewOptions(command);
  command.requiredOption("--out <file>", "the HTML file to write");
  command.addHelpText(
    "after",
    `
Examples:
  cliquescape report out/demo --out out/demo/report.html
  cliquescape report runs/a --out a.html --dataset ../study/manifest.csv`,
  );
  command.action((path: string, raw: Record<string, unknown>, self: Command) => {
    const out = raw.out as string;
    if (!out.toLowerCase().endsWith(".html"))
      throw new UsageError(`--out ${out}: the report is an .html file`);
    const target = openViewTarget(path, viewOptionsOf(raw, self));
    const graphs = target.graphIds.map((id) => [id, target.graph(id)] as const);
    const html = embedData(viewerPageHtml(), target.session, graphs);
    writeFileAtomic(out, html);
    process.stdout.write(
      `cliquescape report: wrote ${out} (${(html.length / 2 ** 20).toFixed(1)} MiB, ${graphs.length} graphs)\nopen it: file://${resolve(out)}\n`,
    );
  });
  return command;
}

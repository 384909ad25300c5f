import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { runCli } from "../cli/run-cli.js";

const DEMO = fileURLToPath(new URL("../../demo-data/", import.meta.url));

/**
 * A small run of the demo dataset: the first `perLabel` graphs of each label (undirected and directed
 * alike), extracted into a fresh folder with the default settings. Returns the run folder.
 */
export function demoSubsetRun(perLabel: number): string {
  const dir = mkdtempSync(join(tmpdir(), "cliquescape-run-"));
  const [header, ...rows] = readFileSync(join(DEMO, "manifest.csv"), "utf8").trim().split("\n");
  const taken = new Map<string, number>();
  const kept = rows.filter((row) => {
    const label = row.split(",")[2];
    taken.set(label, (taken.get(label) ?? 0) + 1);
    return taken.get(label)! <= perLabel;
  });
  // Absolute paths: the manifest lives in the temporary folder, the graphs stay in demo-data/.
  const manifest = [
    header,
    ...kept.map((row) => row.replace(/^([^,]*),([^,]*)/, (_, id, file) => `${id},${join(DEMO, file)}`)),
  ];
  writeFileSync(join(dir, "manifest.csv"), `${manifest.join("\n")}\n`);
  const run = join(dir, "run");
  const extract = runCli(["extract", join(dir, "manifest.csv"), "--out", run]);
  if (extract.status !== 0) throw new Error(`extract failed (${extract.status}):\n${extract.stderr}`);
  return run;
}

import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";

const BIN = fileURLToPath(new URL("../../packages/cli/bin/cliquescape.js", import.meta.url));

export interface CliRun {
  status: number | null;
  stdout: string;
  stderr: string;
}

/** Runs the built command line (npm test builds first) with stderr not a terminal; `cwd`: where it runs. */
export function runCli(args: string[], options: { cwd?: string } = {}): CliRun {
  const run = spawnSync(process.execPath, [BIN, ...args], { encoding: "utf8", cwd: options.cwd });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}

/** Writes files into a fresh temporary folder and returns the folder. */
export function scratchFiles(files: Record<string, string>): string {
  const dir = mkdtempSync(join(tmpdir(), "cliquescape-cli-"));
  for (const [name, text] of Object.entries(files)) writeFileSync(join(dir, name), text);
  return dir;
}

/** A dense matrix as CSV text; null cells are left empty (no edge). */
export function matrixCsv(rows: (number | null)[][]): string {
  return `${rows.map((r) => r.map((x) => (x === null ? "" : String(x))).join(",")).join("\n")}\n`;
}

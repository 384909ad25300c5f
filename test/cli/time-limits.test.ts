/**
 * Every single-graph command and extract are bounded in time and say what they are doing: a graph past
 * --time-limit stops with the stage and how far it got (exit 3; in extract, a row of errors.csv), progress
 * shows while one graph runs, and barcode honours --budget.
 */
import { spawnSync } from "node:child_process";
import { readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { seededRandom } from "../support/random.js";
import { matrixCsv, runCli, scratchFiles } from "./run-cli.js";

const BIN = fileURLToPath(new URL("../../packages/cli/bin/cliquescape.js", import.meta.url));

/**
 * A complete graph with uniform random weights, n = 180, to H4 (`HEAVY_TOP_DIM`): to H3 it now takes about
 * 4 s (docs/benchmarks.md, issue 11's twelfth round), to H4 more than 40 s on the idle project machine,
 * still reducing its 42 million tetrahedron columns: past every limit below on any machine.
 */
const HEAVY_TOP_DIM = "4";
function heavyMatrix(n: number): (number | null)[][] {
  const random = seededRandom(180);
  const m = Array.from({ length: n }, () => Array<number | null>(n).fill(null));
  for (let i = 0; i < n; i++)
    for (let j = i + 1; j < n; j++) m[i][j] = m[j][i] = Math.round(random() * 1e6) / 1e6 + 1e-6;
  return m;
}

const dir = scratchFiles({
  "heavy.csv": matrixCsv(heavyMatrix(180)),
  "small.csv": matrixCsv([
    [null, 1, 2, 1],
    [1, null, 1, null],
    [2, 1, null, 1],
    [1, null, 1, null],
  ]),
});
const heavy = join(dir, "heavy.csv");

/** Runs the CLI with a hard bound of its own, so a limit that is not honoured fails instead of stalling. */
function runBounded(args: string[], boundMs: number) {
  const started = Date.now();
  const run = spawnSync(process.execPath, [BIN, ...args], { encoding: "utf8", timeout: boundMs });
  return { ...run, ms: Date.now() - started };
}

describe("--time-limit", () => {
  for (const command of ["barcode", "inspect", "sweep"]) {
    it(`${command} stops a graph past it with the stage, how far it got and the option to change`, () => {
      const run = runBounded([command, heavy, "--top-dim", HEAVY_TOP_DIM, "--time-limit", "2"], 60_000);
      expect(run.signal).toBeNull();
      expect(run.status).toBe(3);
      expect(run.stderr).toMatch(
        /time limit of 2\.0 s reached while (listing simplices|reducing columns|pairing components|counting simplices)[^(]*\([\d,]+ (of [\d,]+ done|so far), after 2\.\d s\); raise --time-limit/,
      );
      expect(run.stdout).toBe("");
    });
  }

  it("0 means no limit: a small graph finishes", () => {
    const run = runCli(["barcode", join(dir, "small.csv"), "--time-limit", "0", "--format", "json"]);
    expect(run.status).toBe(0);
    expect(JSON.parse(run.stdout).bars.length).toBeGreaterThan(0);
  });
});

describe("progress while one graph runs", () => {
  it("prints a plain line every five seconds when stderr is not a terminal", () => {
    const run = runBounded(["barcode", heavy, "--top-dim", HEAVY_TOP_DIM, "--time-limit", "11"], 90_000);
    expect(run.status).toBe(3);
    const lines = run.stderr.split("\n").filter((line) => line.includes("heavy.csv: "));
    // From 5 s on, at most one line per five seconds (a loaded machine may reach the limit before the
    // second): stage, dimension, columns done of all, seconds.
    expect(lines.length).toBeGreaterThanOrEqual(1);
    const seconds = lines.map((line) => Number(/\((\d+) s\)$/.exec(line)?.[1]));
    expect(seconds[0]).toBeGreaterThanOrEqual(5);
    for (let i = 1; i < seconds.length; i++) expect(seconds[i] - seconds[i - 1]).toBeGreaterThanOrEqual(4);
    expect(lines[0]).toMatch(
      /^cliquescape: .*heavy\.csv: [a-z ]+ of dimension \d: [\d,]+ (of [\d,]+|so far) \(\d+ s\)$/,
    );
  });
});

describe("barcode --budget", () => {
  it("stops once the listed simplices pass it, with counts per dimension", () => {
    const run = runBounded(["barcode", heavy, "--top-dim", "3", "--budget", "100000"], 60_000);
    expect(run.status).toBe(3);
    // 180 vertices and 16,110 edges are listed before the triangles pass the budget.
    expect(run.stderr).toMatch(/simplex budget of 100000 exceeded .* dim 0: 180, dim 1: 16110, dim 2: \d+/);
  });
});

describe("extract --time-limit", () => {
  it("records a graph past it in errors.csv with how far it got, keeps the others, shows what runs", () => {
    const data = scratchFiles({});
    writeFileSync(join(data, "heavy.csv"), readFileSync(heavy));
    writeFileSync(join(data, "small.csv"), readFileSync(join(dir, "small.csv")));
    writeFileSync(join(data, "manifest.csv"), "id,file,label\nheavy,heavy.csv,a\nsmall,small.csv,b\n");
    const out = join(data, "run");
    const run = runBounded(
      [
        "extract",
        join(data, "manifest.csv"),
        "--out",
        out,
        "--threshold",
        "0.2,0.5,0.9",
        "--top-dim",
        HEAVY_TOP_DIM,
        "--barcode-range",
        "full",
        "--workers",
        "1",
        // The 42 million tetrahedra need more than the default 1,024 MiB: the time limit must stop it first.
        "--memory",
        "4096",
        "--time-limit",
        "11",
      ],
      120_000,
    );
    expect(run.status).toBe(1);
    const errors = readFileSync(join(out, "errors.csv"), "utf8");
    expect(errors).toMatch(/heavy\.csv,.*time limit of 11 s reached while .*raise --time-limit/);
    const features = readFileSync(join(out, "features.csv"), "utf8").trim().split("\n");
    expect(features.slice(1).map((line) => line.split(",")[0])).toEqual(["small"]);
    // The plain progress line names the graph in flight and what it is doing.
    expect(run.stderr).toMatch(/graphs: \d+\/2 graphs, .*; heavy: [a-z ]+ of dimension \d: [\d,]+/);
  });
});

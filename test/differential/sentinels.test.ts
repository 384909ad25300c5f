/**
 * Regression tests for the sentinel graphs: small graphs that once made a command hang or fail
 * (test/sentinels, copied from the team's shared sentinel folder; when that folder is present next to the
 * repository its newer files run too). Each runs its recorded command line with the built CLI under a hard
 * time bound, and every threshold of it goes through the differential checks (both clique layouts, the rank
 * path, counts and the sweep), also under a time bound.
 */
import { spawnSync } from "node:child_process";
import { existsSync, readdirSync, readFileSync } from "node:fs";
import { basename, join } from "node:path";
import { fileURLToPath } from "node:url";
import { readGraphFile } from "@cliquescape/io";
import { beforeAll, describe, expect, it } from "vitest";
import { buildCore } from "../support/built-core.js";
import { type DifferentialCase, thresholdsOf } from "../support/differential-cases.js";
import { runDifferentialCases } from "../support/differential-check.js";
import { edgesOf } from "../support/graph-ops.js";

const BIN = fileURLToPath(new URL("../../packages/cli/bin/cliquescape.js", import.meta.url));
const OURS = fileURLToPath(new URL("../sentinels/", import.meta.url));
const SHARED = fileURLToPath(new URL("../../../shared/sentinels/", import.meta.url));
const COMMAND_LIMIT_MS = 60_000;

/** Sentinel files by name: ours, then any the shared folder adds. */
function sentinels(): Map<string, string> {
  const found = new Map<string, string>();
  for (const dir of [OURS, SHARED]) {
    if (!existsSync(dir)) continue;
    for (const name of readdirSync(dir).sort())
      if (name.endsWith(".csv") && !found.has(name)) found.set(name, join(dir, name));
  }
  return found;
}

function argsOf(file: string): string[] {
  const path = file.replace(/\.csv$/, ".args");
  const text = existsSync(path) ? readFileSync(path, "utf8") : "barcode --top-dim 3";
  return text.trim().split(/\s+/);
}

function optionOf(args: string[], name: string): string | undefined {
  const i = args.indexOf(name);
  return i >= 0 ? args[i + 1] : undefined;
}

beforeAll(() => buildCore(), 120_000);

describe("sentinel graphs finish and agree with themselves", () => {
  for (const [name, file] of sentinels()) {
    const [command, ...rest] = argsOf(file);

    it(`${name}: 'cliquescape ${command} ${name} ${rest.join(" ")}' exits 0 within ${COMMAND_LIMIT_MS / 1000} s`, () => {
      const run = spawnSync(process.execPath, [BIN, command, file, ...rest, "--format", "json"], {
        encoding: "utf8",
        timeout: COMMAND_LIMIT_MS,
      });
      expect(run.signal, "killed at the time bound").toBeNull();
      expect(run.stderr).toBe("");
      expect(run.status).toBe(0);
      expect(() => JSON.parse(run.stdout)).not.toThrow();
    });

    it(`${name}: layouts, rank path, counts and sweep agree at every threshold`, async () => {
      const directed = rest.includes("--directed");
      const { graphs } = readGraphFile(file, { directed });
      const graph = edgesOf(graphs[0]);
      const topDim = Number(optionOf(rest, "--top-dim") ?? 3);
      const c: DifferentialCase = {
        index: 0,
        seed: 0,
        shape: `sentinel ${basename(file)}`,
        ties: "few-levels",
        semantics: optionOf(rest, "--weights") === "distance" ? "distance" : "similarity",
        prime: Number(optionOf(rest, "--prime") ?? 2),
        maxDim: topDim - 1,
        graph,
        thresholds: thresholdsOf(graph.weights, 1000),
      };
      const layouts = directed ? ["tables"] : ["dense", "sparse"];
      const { failures, dims } = await runDifferentialCases([c], layouts, 1e6);
      expect(failures).toEqual([]);
      expect(dims).toBe(topDim - 1);
    });
  }
});

describe("sentinel values", () => {
  it("er40-int-distance at distance 17 to dimension 5: the values reported with the hang", () => {
    // Reported in issue 7 from the last commit before the regression; also checked above against the
    // rank path at every threshold.
    const run = spawnSync(
      process.execPath,
      [
        BIN,
        "inspect",
        join(OURS, "er40-int-distance.csv"),
        ...argsOf(join(OURS, "er40-int-distance.csv")).slice(1),
        "--format",
        "json",
      ],
      { encoding: "utf8", timeout: COMMAND_LIMIT_MS },
    );
    const report = JSON.parse(run.stdout);
    expect(report.counts).toEqual([40, 343, 812, 549, 93, 3]);
    expect(report.euler).toBe(50);
    expect(report.betti).toEqual([1, 0, 49, 0, 0]);
  });

  it("hang-9-nodes-edges: 12 bars to H2, as the sparse layout gave while the dense one hung", () => {
    const file = join(OURS, "hang-9-nodes-edges.csv");
    const run = spawnSync(process.execPath, [BIN, "barcode", file, "--top-dim", "3", "--format", "json"], {
      encoding: "utf8",
      timeout: COMMAND_LIMIT_MS,
    });
    expect(JSON.parse(run.stdout).bars).toHaveLength(12);
  });
});

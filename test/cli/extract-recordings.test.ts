/**
 * `extract --measure`: recordings straight to features. Checked against the two-step path the user could
 * take instead (connect, then extract on the matrices it wrote): the same feature table, byte for byte; the
 * measure and its parameters land in spec.json, and `--spec` of that file repeats the whole path; a bad
 * recording is a row of errors.csv with its file, line and column; a directed measure gives directed graphs.
 */
import { readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { seededRandom } from "../support/random.js";
import { runCli, scratchFiles } from "./run-cli.js";

/** Time × channels CSV with a header: channels mix two shared signals, so they correlate with either sign. */
function recordingCsv(seed: number, timePoints: number, channels: number): string {
  const random = seededRandom(seed);
  const shared = [0, 1].map(() => Array.from({ length: timePoints }, () => random() - 0.5));
  const loads = Array.from({ length: channels }, () => [2 * random() - 1, 2 * random() - 1]);
  const lines = [Array.from({ length: channels }, (_, c) => `ch${c}`).join(",")];
  for (let t = 0; t < timePoints; t++) {
    const row = loads.map(([a, b]) =>
      (a * shared[0][t] + b * shared[1][t] + 0.5 * (random() - 0.5)).toFixed(4),
    );
    lines.push(row.join(","));
  }
  return `${lines.join("\n")}\n`;
}

describe("extract --measure on recordings", () => {
  let dir: string;
  beforeAll(() => {
    const files: Record<string, string> = { "manifest.csv": "id,file,label\n" };
    for (let s = 0; s < 6; s++) {
      files[`r${s}.csv`] = recordingCsv(100 + s, 120, 9);
      files["manifest.csv"] += `r${s},r${s}.csv,${s % 2 === 0 ? "a" : "b"}\n`;
    }
    dir = scratchFiles(files);
  });
  const common = ["--negatives", "abs", "--top-dim", "2", "--steps", "6", "--workers", "2"];

  it("equals connect followed by extract on its matrices, byte for byte", () => {
    const direct = runCli([
      "extract",
      join(dir, "manifest.csv"),
      "--out",
      join(dir, "direct"),
      "--measure",
      "partial",
      ...common,
    ]);
    expect(direct.status).toBe(0);
    const connect = runCli([
      "connect",
      join(dir, "manifest.csv"),
      "--out",
      join(dir, "conn"),
      "--measure",
      "partial",
      "--layout",
      "files",
    ]);
    expect(connect.status).toBe(0);
    const twoStep = runCli([
      "extract",
      join(dir, "conn", "manifest.csv"),
      "--out",
      join(dir, "two-step"),
      ...common,
    ]);
    expect(twoStep.status).toBe(0);
    const table = (run: string) => readFileSync(join(dir, run, "features.csv"), "utf8");
    expect(table("direct").split("\n").length).toBe(8); // header, 6 rows, final newline
    expect(table("direct")).toBe(table("two-step"));
  });

  it("records the measure in spec.json; --spec of it repeats the whole path; a rerun skips finished graphs", () => {
    const first = runCli([
      "extract",
      join(dir, "manifest.csv"),
      "--out",
      join(dir, "s1"),
      "--measure",
      "spearman",
      "--fisher-z",
      ...common,
    ]);
    expect(first.status).toBe(0);
    const spec = JSON.parse(readFileSync(join(dir, "s1", "spec.json"), "utf8"));
    expect(spec.connectivity).toEqual({
      measure: "spearman",
      fisherZ: true,
      channelsFirst: false,
      channels: null,
      badChannels: "error",
    });
    expect(Object.keys(spec).slice(0, 4)).toEqual(["format", "toolVersion", "connectivity", "preparation"]);
    const again = runCli([
      "extract",
      join(dir, "manifest.csv"),
      "--out",
      join(dir, "s2"),
      "--spec",
      join(dir, "s1", "spec.json"),
    ]);
    expect(again.status).toBe(0);
    expect(readFileSync(join(dir, "s2", "features.csv"), "utf8")).toBe(
      readFileSync(join(dir, "s1", "features.csv"), "utf8"),
    );
    const resumed = runCli([
      "extract",
      join(dir, "manifest.csv"),
      "--out",
      join(dir, "s1"),
      "--measure",
      "spearman",
      "--fisher-z",
      ...common,
    ]);
    expect(resumed.status).toBe(0);
    expect(resumed.stdout).toMatch(/\(6 already done before this run\)/);
    // Another measure is another setting: the run folder refuses to mix them.
    const other = runCli([
      "extract",
      join(dir, "manifest.csv"),
      "--out",
      join(dir, "s1"),
      "--measure",
      "pearson",
      ...common,
    ]);
    expect(other.status).toBe(2);
    expect(other.stderr).toMatch(/connectivity\.measure: "spearman" → "pearson"/);
  });

  it("a recording with a NaN is a row of errors.csv with its line and column; the others go on", () => {
    const bad = recordingCsv(7, 120, 9).split("\n");
    const cells = bad[5].split(",");
    cells[3] = "nan";
    bad[5] = cells.join(",");
    writeFileSync(join(dir, "bad.csv"), bad.join("\n"));
    writeFileSync(join(dir, "with-bad.csv"), "id,file,label\nr0,r0.csv,a\nbad,bad.csv,b\nr1,r1.csv,b\n");
    const run = runCli([
      "extract",
      join(dir, "with-bad.csv"),
      "--out",
      join(dir, "bad-run"),
      "--measure",
      "pearson",
      ...common,
    ]);
    expect(run.status).toBe(1);
    const errors = readFileSync(join(dir, "bad-run", "errors.csv"), "utf8").split("\n");
    expect(errors[1]).toMatch(
      /^bad,bad\.csv,6,4,"channel 3 \(ch3\) holds NaN at time point 4; a correlation with such a channel is undefined/,
    );
    expect(readFileSync(join(dir, "bad-run", "features.csv"), "utf8").split("\n").length).toBe(4);
  });

  it("lagged correlation gives directed graphs (directed node layout); usage mistakes exit 2", () => {
    const run = runCli([
      "extract",
      join(dir, "manifest.csv"),
      "--out",
      join(dir, "lag"),
      "--measure",
      "lagged",
      "--max-lag",
      "2",
      ...common,
    ]);
    expect(run.status).toBe(0);
    expect(JSON.parse(readFileSync(join(dir, "lag", "spec.json"), "utf8")).nodeLayout).toBe("directed");
    const noLag = runCli([
      "extract",
      join(dir, "manifest.csv"),
      "--out",
      join(dir, "x"),
      "--measure",
      "lagged",
    ]);
    expect(noLag.status).toBe(2);
    expect(noLag.stderr).toMatch(/connectivity: lagged correlation needs maxLag/);
  });
});

/**
 * errors.csv names files relative to the dataset's folder, whatever the working directory: the same bytes
 * when the command runs from `/` with absolute paths, from the dataset's folder, and from another folder
 * with relative paths. Failures of every origin: a reader error (with its line), a budget error raised while
 * computing (no line), and a manifest row naming a missing file.
 */
import { mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { dirname, join, relative } from "node:path";
import { describe, expect, it } from "vitest";
import { runCli, scratchFiles } from "./run-cli.js";

describe("extract: errors.csv paths", () => {
  it("are relative to the dataset's folder, the same from any working directory", () => {
    const root = scratchFiles({});
    const data = join(root, "data");
    mkdirSync(join(data, "sub"), { recursive: true });
    writeFileSync(join(data, "a.csv"), "0,0.5,0.2\n0.5,0,0.9\n0.2,0.9,0\n");
    writeFileSync(join(data, "b.csv"), "0,1\n1\n");
    // Four nodes, every pair an edge: more simplices than the budget of 7 below.
    writeFileSync(join(data, "sub", "c.csv"), "0,0.5,0.2,0.1\n0.5,0,0.9,0.3\n0.2,0.9,0,0.4\n0.1,0.3,0.4,0\n");
    writeFileSync(join(data, "manifest.csv"), "id,file\na,a.csv\nb,b.csv\nc,sub/c.csv\nd,gone.csv\n");
    const options = ["--budget", "7", "--threshold", "0.1,0.5", "--workers", "1"];
    const elsewhere = join(root, "elsewhere", "deeper");
    mkdirSync(elsewhere, { recursive: true });
    const runs = [
      { cwd: "/", manifest: join(data, "manifest.csv"), out: join(root, "from-root") },
      { cwd: data, manifest: "manifest.csv", out: "../from-data" },
      {
        cwd: elsewhere,
        manifest: relative(elsewhere, join(data, "manifest.csv")),
        out: relative(elsewhere, join(root, "from-elsewhere")),
      },
    ];
    const tables = runs.map(({ cwd, manifest, out }) => {
      const run = runCli(["extract", manifest, "--out", out, ...options], { cwd });
      expect(run.status, run.stderr).toBe(1);
      return readFileSync(join(cwd, out, "errors.csv"), "utf8");
    });
    const rows = tables[0].trimEnd().split("\n");
    expect(rows[0]).toBe("id,file,line,column,reason");
    expect(rows.slice(1).map((row) => row.split(",").slice(0, 4).join(","))).toEqual([
      "d,manifest.csv,5,2", // the manifest's problem first, at its line and column
      "b,b.csv,2,", // a reader error, at the line it names
      "c,sub/c.csv,,", // a budget error while computing: the graph's file, made relative once
    ]);
    expect(rows[3]).toContain("simplex budget of 7 exceeded");
    expect(tables[1]).toBe(tables[0]);
    expect(tables[2]).toBe(tables[0]);
    // The records say the same.
    const record = JSON.parse(
      readFileSync(join(dirname(join(root, "from-root")), "from-root", "graphs", "c.json"), "utf8"),
    );
    expect(record.failure.file).toBe("sub/c.csv");
  });
});

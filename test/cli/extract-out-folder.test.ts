/**
 * What `extract --out` may write into: a new path, an empty folder, or a run folder of ours (it carries
 * cliquescape-run.json). A folder of the user's own files is refused with nothing in it changed, even files
 * named like our temporary files; a file given as --out fails before any graph is read; the dataset's own
 * folder, or a run folder holding an input, is refused.
 */
import { existsSync, mkdirSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { folderContents, SMALL_DATASET, similarityDataset } from "./extract-fixtures.js";
import { runCli, scratchFiles } from "./run-cli.js";

describe("extract --out: whose folder it is", () => {
  let dir: string;
  beforeAll(() => {
    dir = similarityDataset(SMALL_DATASET.slice(0, 3));
  });

  it("a folder of the user's own files is refused and left byte for byte as it was", () => {
    // The user's own results, named like ours, and a file named like one of our temporary files.
    const out = scratchFiles({
      "features.csv": "id,score\nmine,1\n",
      ".backup.1.2.tmp": "a backup of the user's\n",
      ".features.csv.123.0.7.tmp": "also the user's\n",
    });
    mkdirSync(join(out, "graphs"));
    writeFileSync(join(out, "graphs", "x.json"), '{"mine":true}\n');
    const before = folderContents(out);
    const run = runCli(["extract", join(dir, "manifest.csv"), "--out", out]);
    expect(run.status).toBe(2);
    expect(run.stderr).toContain(`--out ${out} already holds files`);
    expect(run.stderr).toContain("is not a cliquescape run folder (it has no cliquescape-run.json)");
    expect(run.stderr.trim().split("\n")).toHaveLength(1);
    const after = folderContents(out);
    expect([...after.keys()]).toEqual([...before.keys()]);
    for (const [name, bytes] of before) expect(after.get(name)!.equals(bytes), name).toBe(true);
  });

  it("an empty folder is taken, marked, and resumed as ours on the next run", () => {
    const out = scratchFiles({});
    expect(runCli(["extract", join(dir, "manifest.csv"), "--out", out]).status).toBe(0);
    expect(JSON.parse(readFileSync(join(out, "cliquescape-run.json"), "utf8"))).toEqual({
      kind: "cliquescape run folder",
      version: 1,
    });
    const again = runCli(["extract", join(dir, "manifest.csv"), "--out", out]);
    expect(again.status).toBe(0);
    expect(again.stdout).toContain("(3 already done before this run)");
  });

  it("a run folder of an earlier version (no marker) is refused with the way to adopt it", () => {
    const out = join(scratchFiles({}), "run");
    expect(runCli(["extract", join(dir, "manifest.csv"), "--out", out]).status).toBe(0);
    const marker = join(out, "cliquescape-run.json");
    const text = readFileSync(marker, "utf8");
    // As an earlier version left it: everything but the marker.
    rmSync(marker);
    const run = runCli(["extract", join(dir, "manifest.csv"), "--out", out]);
    expect(run.status).toBe(2);
    expect(run.stderr).toContain("written by an earlier cliquescape, mark it as one");
    writeFileSync(marker, text);
    expect(runCli(["extract", join(dir, "manifest.csv"), "--out", out]).status).toBe(0);
  });

  it("a run that stops before writing anything (a bad spec) leaves no folder and no marker behind", () => {
    const root = scratchFiles({ "bad.json": '{"complex":{"topDim":"x"}}\n' });
    const fresh = join(root, "run");
    const empty = join(root, "empty");
    mkdirSync(empty);
    for (const out of [fresh, empty]) {
      const run = runCli([
        "extract",
        join(dir, "manifest.csv"),
        "--out",
        out,
        "--spec",
        join(root, "bad.json"),
      ]);
      expect(run.status).toBe(2);
      expect(run.stderr).toContain("invalid run spec");
    }
    expect(existsSync(fresh)).toBe(false);
    expect(readdirSync(empty)).toEqual([]);
  });

  it("--out naming a file fails at once, before the first pass reads any graph", () => {
    const file = join(scratchFiles({ "notes.txt": "keep me\n" }), "notes.txt");
    // A dataset whose first pass would fail on its only graph: reaching it would give another message.
    const broken = scratchFiles({ "a.csv": "0,1\n1\n" });
    const run = runCli(["extract", broken, "--out", file]);
    expect(run.status).toBe(74);
    expect(run.stderr).toBe(
      `cliquescape: --out ${file}: cannot write: it is a file, not a folder (ENOTDIR)\n`,
    );
    expect(readFileSync(file, "utf8")).toBe("keep me\n");
    // A path below a file: the system's ENOTDIR, named the same way.
    const below = runCli(["extract", broken, "--out", join(file, "run")]);
    expect(below.status).toBe(74);
    expect(below.stderr).toContain(`--out ${join(file, "run")}: cannot write`);
    expect(below.stderr).toContain("(ENOTDIR)");
    expect(statSync(file).isFile()).toBe(true);
  });

  it("the dataset's own folder is refused as --out; a sub-folder of a folder dataset is not read", () => {
    const data = scratchFiles({ "a.csv": "0,1,0.5\n1,0,0.2\n0.5,0.2,0\n", "b.csv": "0,1\n1,0\n" });
    const same = runCli(["extract", data, "--out", data, "--steps", "3"]);
    expect(same.status).toBe(2);
    expect(same.stderr).toContain(`--out ${data} is the dataset's folder`);
    // Inside: only files directly in the dataset's folder are graphs, so the run's tables are never read.
    const inside = join(data, "run");
    for (let k = 0; k < 2; k++) {
      const run = runCli(["extract", data, "--out", inside, "--steps", "3"]);
      expect(run.status).toBe(0);
      expect(run.stdout).toContain("2 graphs in the tables");
      expect(readFileSync(join(inside, "errors.csv"), "utf8")).toBe("id,file,line,column,reason\n");
    }
  });

  it("a run folder holding an input of the run (the manifest, a graph file) is refused", () => {
    const out = scratchFiles({});
    const data = similarityDataset(SMALL_DATASET.slice(0, 2));
    // A marked run folder the user then put the dataset into.
    expect(runCli(["extract", join(data, "manifest.csv"), "--out", out]).status).toBe(0);
    writeFileSync(join(out, "q.csv"), readFileSync(join(data, "a1.csv")));
    const manifest = join(scratchFiles({}), "manifest.csv");
    writeFileSync(manifest, `id,file\nq,${join(out, "q.csv")}\n`);
    const run = runCli(["extract", manifest, "--out", out]);
    expect(run.status).toBe(2);
    expect(run.stderr).toContain(`--out ${out} holds an input of the run (${join(out, "q.csv")})`);
    // The manifest itself in the run folder: the run folder is then the dataset's folder.
    writeFileSync(join(out, "manifest.csv"), `id,file\nq,q.csv\n`);
    const inside = runCli(["extract", join(out, "manifest.csv"), "--out", out]);
    expect(inside.status).toBe(2);
    expect(inside.stderr).toContain(`--out ${out} is the dataset's folder`);
  });
});

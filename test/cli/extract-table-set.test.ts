/**
 * features.csv, features.npz and errors.csv are one set: all three are written whole under temporary names
 * before any is renamed into place, and tables.json records the length and SHA-256 of each afterwards.
 * - a full disk while the tables are written (a 2 MiB tmpfs, filled by the test) leaves the previous set
 *   exactly as it was, with tables.json still describing it, and no temporary file;
 * - a run stopped between the renames (new features.csv, old features.npz) is refused by the readers
 *   (`report`, `distances`) and rewritten whole by the next run, which says so.
 * The checksums are recomputed here with node:crypto (SHA-256, FIPS 180-4).
 */
import { createHash } from "node:crypto";
import { copyFileSync, existsSync, readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { readFeatureTable, similarityDataset } from "./extract-fixtures.js";
import { runCli, scratchFiles } from "./run-cli.js";
import { mountSmallDisk, type SmallDisk, smallDiskMissing } from "./small-disk.js";

const GRAPHS = Array.from({ length: 8 }, (_, i) => ({
  id: `t${i}`,
  label: ["p", "q"][i % 2],
  directed: false,
  n: 14,
  seed: 500 + i,
}));
const TABLES = ["features.csv", "features.npz", "errors.csv"];

/** The dataset with a second manifest naming only the first seven graphs. */
function datasetOf7And8(): { seven: string; eight: string } {
  const dir = similarityDataset(GRAPHS);
  const eight = join(dir, "manifest.csv");
  const lines = readFileSync(eight, "utf8").trimEnd().split("\n");
  const seven = join(dir, "seven.csv");
  writeFileSync(seven, `${lines.slice(0, 8).join("\n")}\n`);
  return { seven, eight };
}

/** Whether tables.json describes the three tables as they are, checked independently of the program. */
function setIsWhole(run: string): boolean {
  const manifest = JSON.parse(readFileSync(join(run, "tables.json"), "utf8"));
  return TABLES.every((name) => {
    const bytes = readFileSync(join(run, name));
    const entry = manifest.files[name];
    return entry.bytes === bytes.length && entry.sha256 === createHash("sha256").update(bytes).digest("hex");
  });
}

function tablesOf(run: string): Map<string, Buffer> {
  return new Map([...TABLES, "tables.json"].map((name) => [name, readFileSync(join(run, name))]));
}

function temporaryFiles(run: string): string[] {
  return readdirSync(run, { recursive: true, encoding: "utf8" }).filter((name) => name.endsWith(".tmp"));
}

describe("extract: the three tables as one set", () => {
  it("tables.json lists the length and SHA-256 of each table; the rows agree", () => {
    const { seven } = datasetOf7And8();
    const run = join(scratchFiles({}), "run");
    expect(runCli(["extract", seven, "--out", run, "--no-bundles"]).status).toBe(0);
    expect(setIsWhole(run)).toBe(true);
    const manifest = JSON.parse(readFileSync(join(run, "tables.json"), "utf8"));
    expect(manifest.graphs).toBe(7);
    expect(manifest.errors).toBe(0);
    expect(readFeatureTable(join(run, "features.csv")).rows).toHaveLength(7);
  });

  it("a run stopped between the renames is refused by the readers and rewritten whole by the next run", () => {
    const { seven, eight } = datasetOf7And8();
    const root = scratchFiles({});
    const run = join(root, "run");
    const other = join(root, "other");
    expect(runCli(["extract", seven, "--out", run]).status).toBe(0);
    expect(runCli(["extract", eight, "--out", other]).status).toBe(0);
    // What a stop after the first rename leaves: the new features.csv beside the old features.npz.
    copyFileSync(join(other, "features.csv"), join(run, "features.csv"));
    expect(setIsWhole(run)).toBe(false);
    const report = runCli(["report", run, "--out", join(root, "page.html")]);
    expect(report.status).toBe(2);
    expect(report.stderr).toContain(
      `${run}: the tables are not a whole set (features.csv is not the one tables.json lists`,
    );
    expect(report.stderr).toContain("run the same extract command again to rewrite them");
    const distances = runCli(["distances", run, "--out", join(root, "d")]);
    expect(distances.status).toBe(2);
    expect(distances.stderr).toContain("the tables are not a whole set");
    const again = runCli(["extract", seven, "--out", run]);
    expect(again.status).toBe(0);
    expect(again.stderr).toContain(
      `the tables in ${run} are not a whole set (features.csv is not the one tables.json lists`,
    );
    expect(setIsWhole(run)).toBe(true);
    expect(readFeatureTable(join(run, "features.csv")).rows).toHaveLength(7);
    // A first set stopped before tables.json was written is noticed the same way.
    rmSync(join(run, "tables.json"));
    const first = runCli(["report", run, "--out", join(root, "page.html")]);
    expect(first.status).toBe(2);
    expect(first.stderr).toContain(
      "tables.json is missing: the run was stopped while writing its first tables",
    );
  });

  describe.skipIf(smallDiskMissing !== null)(`on a full disk ${smallDiskMissing ?? ""}`, () => {
    let disk: SmallDisk | undefined;
    afterAll(() => disk?.unmount());

    it("a full disk while the tables are written leaves the previous set whole; the finished graph is kept", () => {
      disk = mountSmallDisk(2);
      const { seven, eight } = datasetOf7And8();
      const run = join(disk.dir, "run");
      expect(runCli(["extract", seven, "--out", run, "--no-bundles", "--no-barcodes"]).status).toBe(0);
      const before = tablesOf(run);
      // Room for the new spec.json and the eighth graph's record (a page each), not for the tables.
      const filler = disk.fillLeaving(3);
      const full = runCli(["extract", eight, "--out", run, "--no-bundles", "--no-barcodes"]);
      expect(full.status).toBe(74);
      expect(full.stderr.trim().split("\n")).toHaveLength(1);
      expect(full.stderr).toContain(`cliquescape: --out ${run}: cannot write ${run}/features.csv: `);
      expect(full.stderr).toContain("no space left on the device (ENOSPC)");
      const after = tablesOf(run);
      for (const [name, bytes] of before) expect(after.get(name)!.equals(bytes), name).toBe(true);
      expect(setIsWhole(run)).toBe(true);
      expect(temporaryFiles(run)).toEqual([]);
      // The eighth graph finished before the tables: its record is kept and reused.
      expect(JSON.parse(readFileSync(join(run, "graphs", "t7.json"), "utf8")).ok).toBe(true);
      rmSync(filler);
      const resumed = runCli(["extract", eight, "--out", run, "--no-bundles", "--no-barcodes"]);
      expect(resumed.status).toBe(0);
      expect(resumed.stdout).toContain("(8 already done before this run)");
      expect(setIsWhole(run)).toBe(true);
      expect(readFeatureTable(join(run, "features.csv")).rows).toHaveLength(8);
      expect(existsSync(join(run, "run.lock"))).toBe(false);
    });
  });
});

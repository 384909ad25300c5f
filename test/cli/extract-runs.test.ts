/**
 * Run-folder guarantees of `extract`: output bytes do not depend on the number of workers; a run
 * interrupted with Ctrl-C (SIGINT) and run again equals a run that was never interrupted; a run folder
 * made under other settings is refused with the settings that differ. Reference: the uninterrupted,
 * single-worker run of the same command.
 */
import { spawn } from "node:child_process";
import { createHash } from "node:crypto";
import { cpSync, existsSync, readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { beforeAll, describe, expect, it } from "vitest";
import { folderContents, SMALL_DATASET, similarityDataset } from "./extract-fixtures.js";
import { runCli } from "./run-cli.js";

const BIN = fileURLToPath(new URL("../../packages/cli/bin/cliquescape.js", import.meta.url));

/** Enough graphs, each slow enough (dense, 3-simplices, H2), for an interrupt to land in the middle. */
const SLOW_DATASET = Array.from({ length: 16 }, (_, i) => ({
  id: `g${String(i).padStart(2, "0")}`,
  label: ["x", "y", "z"][i % 3],
  directed: i % 4 === 3,
  n: 30 + (i % 5),
  seed: 100 + i,
}));

describe("extract run folders", () => {
  let dir: string;
  beforeAll(() => {
    dir = similarityDataset(SMALL_DATASET);
  });

  it("1 worker and 2 workers write byte-identical folders", () => {
    const one = runCli(["extract", join(dir, "manifest.csv"), "--out", join(dir, "w1"), "--workers", "1"]);
    const two = runCli(["extract", join(dir, "manifest.csv"), "--out", join(dir, "w2"), "--workers", "2"]);
    expect(one.status).toBe(0);
    expect(two.status).toBe(0);
    const a = folderContents(join(dir, "w1"));
    const b = folderContents(join(dir, "w2"));
    expect([...b.keys()]).toEqual([...a.keys()]);
    // marker, spec, two feature tables, errors, tables.json + 3 per graph
    expect(a.size).toBe(6 + 3 * SMALL_DATASET.length);
    for (const [name, bytes] of a) expect(b.get(name)!.equals(bytes), name).toBe(true);
  });

  it("re-running skips finished graphs and changes no byte", () => {
    const out = join(dir, "again");
    expect(runCli(["extract", join(dir, "manifest.csv"), "--out", out]).status).toBe(0);
    const before = folderContents(out);
    const again = runCli(["extract", join(dir, "manifest.csv"), "--out", out]);
    expect(again.status).toBe(0);
    expect(again.stdout).toContain(`(${SMALL_DATASET.length} already done before this run)`);
    const after = folderContents(out);
    for (const [name, bytes] of before) expect(after.get(name)!.equals(bytes), name).toBe(true);
  });

  it("a truncated bundle is noticed (its size disagrees with the record) and that graph redone", () => {
    const out = join(dir, "damaged");
    expect(runCli(["extract", join(dir, "manifest.csv"), "--out", out]).status).toBe(0);
    const before = folderContents(out);
    const bundle = join(out, "bundles", `${SMALL_DATASET[1].id}.npz`);
    writeFileSync(bundle, readFileSync(bundle).subarray(0, 100));
    const again = runCli(["extract", join(dir, "manifest.csv"), "--out", out]);
    expect(again.status).toBe(0);
    expect(again.stdout).toContain(`(${SMALL_DATASET.length - 1} already done before this run)`);
    const after = folderContents(out);
    for (const [name, bytes] of before) expect(after.get(name)!.equals(bytes), name).toBe(true);
  });

  it("a zero-filled bundle, barcode or record of the right length is noticed by its checksum and redone", () => {
    const out = join(dir, "zeroed");
    expect(runCli(["extract", join(dir, "manifest.csv"), "--out", out]).status).toBe(0);
    const before = folderContents(out);
    // What a power cut can leave of a file whose data never reached the disk: its length, all zeros.
    const zeroFill = (path: string) => writeFileSync(path, Buffer.alloc(readFileSync(path).length));
    zeroFill(join(out, "bundles", `${SMALL_DATASET[0].id}.npz`));
    zeroFill(join(out, "barcodes", `${SMALL_DATASET[2].id}.json`));
    zeroFill(join(out, "graphs", `${SMALL_DATASET[4].id}.json`));
    // And a bundle of the right length holding another graph's bytes.
    const other = readFileSync(join(out, "bundles", `${SMALL_DATASET[5].id}.npz`));
    const target = join(out, "bundles", `${SMALL_DATASET[6].id}.npz`);
    const sameLength = Buffer.alloc(readFileSync(target).length);
    other.copy(sameLength, 0, 0, Math.min(other.length, sameLength.length));
    writeFileSync(target, sameLength);
    const again = runCli(["extract", join(dir, "manifest.csv"), "--out", out]);
    expect(again.status).toBe(0);
    expect(again.stdout).toContain(`(${SMALL_DATASET.length - 4} already done before this run)`);
    const after = folderContents(out);
    for (const [name, bytes] of before) expect(after.get(name)!.equals(bytes), name).toBe(true);
    const record = JSON.parse(readFileSync(join(out, "graphs", `${SMALL_DATASET[0].id}.json`), "utf8"));
    // Reference: node:crypto's SHA-256 (FIPS 180-4) of the bundle as it is on disk now.
    expect(record.digests.bundle).toBe(
      createHash("sha256")
        .update(readFileSync(join(out, "bundles", `${SMALL_DATASET[0].id}.npz`)))
        .digest("hex"),
    );
  });

  it("a changed spec is refused, naming the settings that differ", () => {
    const out = join(dir, "refuse");
    expect(runCli(["extract", join(dir, "manifest.csv"), "--out", out]).status).toBe(0);
    const before = folderContents(out);
    const changed = runCli([
      "extract",
      join(dir, "manifest.csv"),
      "--out",
      out,
      "--top-dim",
      "2",
      "--prime",
      "3",
    ]);
    expect(changed.status).toBe(2);
    expect(changed.stderr).toContain("refusing to mix");
    expect(changed.stderr).toContain("complex.topDim: 3 → 2");
    expect(changed.stderr).toContain("complex.prime: 2 → 3");
    const after = folderContents(out);
    for (const [name, bytes] of before) expect(after.get(name)!.equals(bytes), name).toBe(true);
  });

  it("a previous spec.json passed with --spec reproduces the grid exactly on new data", () => {
    const out = join(dir, "first");
    expect(runCli(["extract", join(dir, "manifest.csv"), "--out", out]).status).toBe(0);
    const other = similarityDataset(SMALL_DATASET.map((g) => ({ ...g, seed: g.seed + 1000 })));
    const reuse = runCli([
      "extract",
      join(other, "manifest.csv"),
      "--out",
      join(other, "run"),
      "--spec",
      join(out, "spec.json"),
    ]);
    expect(reuse.status).toBe(0);
    const specA = JSON.parse(readFileSync(join(out, "spec.json"), "utf8"));
    const specB = JSON.parse(readFileSync(join(other, "run", "spec.json"), "utf8"));
    expect(specB.resolvedGrid).toEqual(specA.resolvedGrid);
    expect(specB.inputs).not.toEqual(specA.inputs);
    const header = (folder: string) => readFileSync(join(folder, "features.csv"), "utf8").split("\n")[0];
    expect(header(join(other, "run"))).toBe(header(out));
  });

  it("Ctrl-C keeps finished graphs; the run resumed equals an uninterrupted run", async () => {
    const slow = similarityDataset(SLOW_DATASET);
    const args = (out: string) => [
      "extract",
      join(slow, "manifest.csv"),
      "--out",
      out,
      "--workers",
      "2",
      "--top-dim",
      "4",
    ];
    const reference = join(slow, "reference");
    expect(runCli(args(reference)).status).toBe(0);

    const out = join(slow, "interrupted");
    const { status, recordsAtExit } = await interruptAfter(args(out), join(out, "graphs"), 4);
    expect(status).toBe(130);
    expect(recordsAtExit).toBeGreaterThanOrEqual(4);
    expect(recordsAtExit).toBeLessThan(SLOW_DATASET.length); // really stopped midway
    // Nothing half-written: no temporary files, and the tables list exactly the finished graphs.
    const files = [...folderContents(out).keys()];
    expect(files.filter((f) => f.endsWith(".tmp"))).toEqual([]);
    const rows = readFileSync(join(out, "features.csv"), "utf8").trimEnd().split("\n").length - 1;
    expect(rows).toBe(recordsAtExit);

    const resumed = runCli(args(out));
    expect(resumed.status).toBe(0);
    expect(resumed.stdout).toContain(`(${recordsAtExit} already done before this run)`);
    const a = folderContents(reference);
    const b = folderContents(out);
    expect([...b.keys()]).toEqual([...a.keys()]);
    for (const [name, bytes] of a) expect(b.get(name)!.equals(bytes), name).toBe(true);
  });

  it("a run folder copied elsewhere resumes the same way (records hold no absolute paths)", () => {
    const out = join(dir, "moved-from");
    expect(runCli(["extract", join(dir, "manifest.csv"), "--out", out]).status).toBe(0);
    const moved = join(dir, "moved-to");
    cpSync(out, moved, { recursive: true });
    rmSync(out, { recursive: true });
    const again = runCli(["extract", join(dir, "manifest.csv"), "--out", moved]);
    expect(again.status).toBe(0);
    expect(again.stdout).toContain(`(${SMALL_DATASET.length} already done before this run)`);
    expect(existsSync(join(moved, "features.npz"))).toBe(true);
  });
});

/** Starts the command, sends SIGINT once `minimum` per-graph records exist, and waits for it to exit. */
function interruptAfter(
  args: string[],
  recordDir: string,
  minimum: number,
): Promise<{ status: number | null; recordsAtExit: number }> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [BIN, ...args], { stdio: ["ignore", "pipe", "pipe"] });
    let stderr = "";
    child.stderr.on("data", (chunk) => {
      stderr += chunk;
    });
    const count = () =>
      existsSync(recordDir) ? readdirSync(recordDir).filter((f) => f.endsWith(".json")).length : 0;
    const poll = setInterval(() => {
      if (count() >= minimum) {
        clearInterval(poll);
        child.kill("SIGINT");
      }
    }, 5);
    child.on("error", reject);
    child.on("exit", (status) => {
      clearInterval(poll);
      if (status !== 130) reject(new Error(`exit ${status}: ${stderr}`));
      else resolve({ status, recordsAtExit: count() });
    });
  });
}

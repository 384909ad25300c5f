/**
 * Writes the system refuses, in real conditions: a full disk (a 2 MiB tmpfs mounted by the test), a
 * read-only file system (the same tmpfs remounted read-only), a folder the user may not write (the program
 * run as user nobody, as root bypasses permission bits; as the folder's owner with its write bit removed
 * otherwise). Each gives one line naming --out, the path and the errno code, exit code 74, and keeps every
 * finished graph: the graphs saved before are whole (their files match the SHA-256 in their records) and
 * the next run, once the disk has room, reuses them and ends with the folder a roomy disk gives.
 */
import { spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import { chmodSync, existsSync, mkdirSync, readdirSync, readFileSync, rmSync, statSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { afterEach, describe, expect, it } from "vitest";
import { folderContents, similarityDataset } from "./extract-fixtures.js";
import { runCli, scratchFiles } from "./run-cli.js";
import { mountSmallDisk, type SmallDisk, smallDiskMissing } from "./small-disk.js";

const BIN = fileURLToPath(new URL("../../packages/cli/bin/cliquescape.js", import.meta.url));

const GRAPHS = Array.from({ length: 24 }, (_, i) => ({
  id: `s${String(i).padStart(2, "0")}`,
  label: ["u", "v", "w"][i % 3],
  directed: i % 5 === 4,
  n: 18 + (i % 6),
  seed: 700 + i,
}));

/** Every graph whose record is in the folder: whole (bundle and barcode match the record's SHA-256). */
function keptGraphs(run: string): string[] {
  const sha = (path: string) => createHash("sha256").update(readFileSync(path)).digest("hex");
  return readdirSync(join(run, "graphs"))
    .filter((name) => name.endsWith(".json"))
    .map((name) => {
      const record = JSON.parse(readFileSync(join(run, "graphs", name), "utf8"));
      expect(record.ok, name).toBe(true);
      expect(sha(join(run, "bundles", `${record.id}.npz`)), name).toBe(record.digests.bundle);
      expect(sha(join(run, "barcodes", `${record.id}.json`)), name).toBe(record.digests.barcode);
      return record.id as string;
    });
}

function temporaryFiles(run: string): string[] {
  return readdirSync(run, { recursive: true, encoding: "utf8" }).filter((name) => name.endsWith(".tmp"));
}

describe.skipIf(smallDiskMissing !== null)(
  `extract on a full or read-only disk ${smallDiskMissing ?? ""}`,
  () => {
    let disk: SmallDisk | undefined;
    afterEach(() => {
      disk?.unmount();
      disk = undefined;
    });

    it("a disk that fills up mid-run: one line, exit 74, every finished graph kept and reused", () => {
      const manifest = join(similarityDataset(GRAPHS), "manifest.csv");
      // The reference: the same run on a roomy disk.
      const roomy = join(scratchFiles({}), "run");
      expect(runCli(["extract", manifest, "--out", roomy, "--workers", "2"]).status).toBe(0);
      disk = mountSmallDisk(2);
      const run = join(disk.dir, "run");
      // Room for some graphs' files, not for all 24 (each takes three pages of 4 KiB or more).
      const filler = disk.fillLeaving(30);
      const full = runCli(["extract", manifest, "--out", run, "--workers", "2"]);
      expect(full.status).toBe(74);
      const lines = full.stderr.trim().split("\n");
      expect(lines).toHaveLength(1);
      expect(lines[0]).toMatch(
        new RegExp(
          `^cliquescape: --out ${run}: cannot write ${run}/\\S+: no space left on the device \\(ENOSPC\\); ` +
            "the \\d+ graphs finished are kept; run the same command again to finish$",
        ),
      );
      expect(full.stderr).not.toContain("    at "); // no stack trace
      const kept = keptGraphs(run);
      expect(kept.length).toBeGreaterThan(0);
      expect(kept.length).toBeLessThan(GRAPHS.length);
      expect(lines[0]).toContain(`the ${kept.length} graphs finished are kept`);
      expect(temporaryFiles(run)).toEqual([]);
      expect(existsSync(join(run, "run.lock"))).toBe(false);
      rmSync(filler);
      const resumed = runCli(["extract", manifest, "--out", run, "--workers", "2"]);
      expect(resumed.status).toBe(0);
      expect(resumed.stdout).toContain(`(${kept.length} already done before this run)`);
      const a = folderContents(roomy);
      const b = folderContents(run);
      expect([...b.keys()]).toEqual([...a.keys()]);
      for (const [name, bytes] of a) expect(b.get(name)!.equals(bytes), name).toBe(true);
    }, 240_000);

    it("a read-only file system: a new --out and a resumed one both fail with one line, nothing changed", () => {
      const dir = similarityDataset(GRAPHS.slice(0, 6));
      disk = mountSmallDisk(2);
      const run = join(disk.dir, "run");
      const manifest = join(dir, "manifest.csv");
      expect(runCli(["extract", manifest, "--out", run]).status).toBe(0);
      const before = folderContents(run);
      disk.readOnly(true);
      const fresh = runCli(["extract", manifest, "--out", join(disk.dir, "new")]);
      expect(fresh.status).toBe(74);
      expect(fresh.stderr).toBe(
        `cliquescape: --out ${join(disk.dir, "new")}: cannot write: the file system is read-only (EROFS); ` +
          "nothing in the folder was lost; run the same command again once it can be written\n",
      );
      const resumed = runCli(["extract", manifest, "--out", run]);
      expect(resumed.status).toBe(74);
      expect(resumed.stderr).toBe(
        `cliquescape: --out ${run}: cannot write ${run}/run.lock: the file system is read-only (EROFS); ` +
          "nothing in the folder was lost; run the same command again once it can be written\n",
      );
      const after = folderContents(run);
      expect([...after.keys()]).toEqual([...before.keys()]);
      for (const [name, bytes] of before) expect(after.get(name)!.equals(bytes), name).toBe(true);
    }, 120_000);
  },
);

describe("extract into a folder it may not write", () => {
  it("permission denied: one line naming --out and the path, exit 74, the folder unchanged", () => {
    const dir = similarityDataset(GRAPHS.slice(0, 3));
    const parent = scratchFiles({});
    const locked = join(parent, "locked");
    mkdirSync(locked);
    const out = join(locked, "run");
    const asRoot = process.getuid?.() === 0;
    // Root bypasses permission bits: run the program as user nobody, who may read but not write here.
    for (const path of [dir, parent, locked]) chmodSync(path, asRoot ? 0o755 : 0o555);
    if (!asRoot) chmodSync(dir, 0o755);
    for (const name of readdirSync(dir)) chmodSync(join(dir, name), 0o644);
    const args = [BIN, "extract", join(dir, "manifest.csv"), "--out", out];
    if (asRoot) {
      // User nobody must be able to load the program: a checkout under a private folder (mode 0700, as
      // mktemp -d makes) would fail here with exit 1 for a reason that has nothing to do with --out.
      const probe = spawnSync(
        process.execPath,
        ["-e", `require("node:fs").accessSync(${JSON.stringify(BIN)})`],
        {
          uid: 65534,
          gid: 65534,
        },
      );
      if (probe.status !== 0) {
        chmodSync(locked, 0o755);
        throw new Error(`user nobody cannot read ${BIN}: run the tests from a checkout every user may enter`);
      }
    }
    const run = spawnSync(process.execPath, args, {
      encoding: "utf8",
      ...(asRoot ? { uid: 65534, gid: 65534 } : {}),
    });
    chmodSync(locked, 0o755);
    expect(run.status).toBe(74);
    expect(run.stderr).toBe(
      `cliquescape: --out ${out}: cannot write: permission denied (EACCES); ` +
        "nothing in the folder was lost; run the same command again once it can be written\n",
    );
    expect(readdirSync(locked)).toEqual([]);
    expect(statSync(locked).isDirectory()).toBe(true);
  });
});

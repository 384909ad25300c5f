/**
 * One run per run folder: a second `extract` process on the same --out refuses at once (exit 75), naming
 * the folder and the run holding it (pid, host, start time), and changes nothing; a lock left by a run that
 * was killed (its pid no longer exists on this host) is taken over with a note. Real processes of the built
 * command line throughout.
 */
import { type ChildProcess, spawn, spawnSync } from "node:child_process";
import { existsSync, readFileSync, writeFileSync } from "node:fs";
import { hostname } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { beforeAll, describe, expect, it } from "vitest";
import { folderContents, similarityDataset } from "./extract-fixtures.js";
import { runCli, scratchFiles } from "./run-cli.js";

const BIN = fileURLToPath(new URL("../../packages/cli/bin/cliquescape.js", import.meta.url));

/** Dense graphs with 3-simplices and H2: a run of several seconds on one worker. */
const SLOW_DATASET = Array.from({ length: 12 }, (_, i) => ({
  id: `g${String(i).padStart(2, "0")}`,
  label: ["x", "y"][i % 2],
  directed: false,
  n: 36 + (i % 4),
  seed: 300 + i,
}));

/** Null-model columns make each graph take a while (seeded: the output is still deterministic). */
const SLOW = ["--workers", "1", "--top-dim", "4", "--null-model", "shuffle", "--null-samples", "30"];

function start(args: string[]): {
  child: ChildProcess;
  done: Promise<{ code: number | null; stderr: string }>;
} {
  const child = spawn(process.execPath, [BIN, ...args], { stdio: ["ignore", "ignore", "pipe"] });
  let stderr = "";
  child.stderr!.on("data", (chunk) => {
    stderr += chunk;
  });
  const done = new Promise<{ code: number | null; stderr: string }>((resolve) =>
    child.on("close", (code) => resolve({ code, stderr })),
  );
  return { child, done };
}

async function until(condition: () => boolean, seconds: number): Promise<void> {
  const end = Date.now() + seconds * 1000;
  while (!condition()) {
    if (Date.now() > end) throw new Error(`condition not met within ${seconds} s`);
    await new Promise((r) => setTimeout(r, 20));
  }
}

describe("extract: one run per run folder", () => {
  let manifest: string;
  beforeAll(() => {
    manifest = join(similarityDataset(SLOW_DATASET), "manifest.csv");
  });

  it("a second process on the same folder refuses at once, naming the holder; the first finishes whole", async () => {
    const out = join(scratchFiles({}), "run");
    const first = start(["extract", manifest, "--out", out, ...SLOW]);
    const lock = join(out, "run.lock");
    await until(() => existsSync(lock), 60);
    const holder = JSON.parse(readFileSync(lock, "utf8"));
    expect(holder.pid).toBe(first.child.pid);
    expect(holder.host).toBe(hostname());
    // Other settings too: before the lock, this is what left one spec and tables of another.
    const second = runCli(["extract", manifest, "--out", out, "--workers", "1", "--top-dim", "2"]);
    const stillRunning = first.child.exitCode === null;
    expect(second.status).toBe(75);
    expect(second.stderr).toBe(
      `cliquescape: --out ${out} is in use by another run: pid ${first.child.pid} on this host ` +
        `${hostname()}, started ${holder.started} (lock ${lock}). Wait for it to end, or choose another --out.\n`,
    );
    expect(stillRunning, "the first run was still running when the second was refused").toBe(true);
    const ended = await first.done;
    expect(ended.code).toBe(0);
    expect(existsSync(lock)).toBe(false);
    // The folder is exactly what a run alone writes.
    const alone = join(scratchFiles({}), "alone");
    expect(runCli(["extract", manifest, "--out", alone, ...SLOW]).status).toBe(0);
    const a = folderContents(alone);
    const b = folderContents(out);
    expect([...b.keys()]).toEqual([...a.keys()]);
    for (const [name, bytes] of a) expect(b.get(name)!.equals(bytes), name).toBe(true);
  }, 240_000);

  it("two processes started together on a new folder: one runs, the other refuses", async () => {
    const out = join(scratchFiles({}), "run");
    const args = ["extract", manifest, "--out", out, ...SLOW];
    const [a, b] = [start(args), start(args)];
    const results = await Promise.all([a.done, b.done]);
    const codes = results.map((r) => r.code).sort();
    expect(codes).toEqual([0, 75]);
    const refused = results.find((r) => r.code === 75)!;
    expect(refused.stderr).toMatch(/is in use by another run: pid \d+ on this host/);
  }, 240_000);

  it("a lock left by a killed run (no such pid on this host) is taken over with a note", () => {
    const out = join(scratchFiles({}), "run");
    const data = join(similarityDataset(SLOW_DATASET.slice(0, 2)), "manifest.csv");
    expect(runCli(["extract", data, "--out", out]).status).toBe(0);
    // A process that has ended: its pid names no process now.
    const ended = spawnSync(process.execPath, ["-e", "process.stdout.write(String(process.pid))"], {
      encoding: "utf8",
    });
    const deadPid = Number(ended.stdout);
    const boot = existsSync("/proc/sys/kernel/random/boot_id")
      ? readFileSync("/proc/sys/kernel/random/boot_id", "utf8").trim()
      : null;
    const stale = { pid: deadPid, host: hostname(), started: "2026-01-02T03:04:05.000Z", boot };
    writeFileSync(join(out, "run.lock"), `${JSON.stringify(stale)}\n`);
    const run = runCli(["extract", data, "--out", out]);
    expect(run.status).toBe(0);
    expect(run.stderr).toContain(
      `took over the lock of a run that ended without releasing it (pid ${deadPid} on ${hostname()}, started 2026-01-02T03:04:05.000Z) in ${out}`,
    );
    expect(existsSync(join(out, "run.lock"))).toBe(false);
  }, 120_000);

  it("a lock of another host is never taken over: refused with how to clear it", () => {
    const out = join(scratchFiles({}), "run");
    const data = join(similarityDataset(SLOW_DATASET.slice(0, 2)), "manifest.csv");
    expect(runCli(["extract", data, "--out", out]).status).toBe(0);
    const lock = join(out, "run.lock");
    const other = {
      pid: 4242,
      host: "node-17.cluster.invalid",
      started: "2026-01-02T03:04:05.000Z",
      boot: null,
    };
    writeFileSync(lock, `${JSON.stringify(other)}\n`);
    const before = folderContents(out);
    const run = runCli(["extract", data, "--out", out]);
    expect(run.status).toBe(75);
    expect(run.stderr).toBe(
      `cliquescape: --out ${out} is in use by another run: pid 4242 on host node-17.cluster.invalid, ` +
        `started 2026-01-02T03:04:05.000Z (lock ${lock}). Wait for it to end, or choose another --out. ` +
        `If that run is gone (its machine stopped), delete ${lock} and run again.\n`,
    );
    const after = folderContents(out);
    for (const [name, bytes] of before) expect(after.get(name)!.equals(bytes), name).toBe(true);
  }, 120_000);
});

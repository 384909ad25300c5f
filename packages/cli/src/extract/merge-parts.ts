import { copyFileSync, existsSync, linkSync, readdirSync, renameSync, rmSync, statSync } from "node:fs";
import { basename, dirname, join } from "node:path";
import { UsageError } from "../options/graph-options.js";
import { type ExtractResult, finishRun } from "./finish-run.js";
import { type GraphRecord, readRecord } from "./graph-record.js";
import { validateSpec } from "./load-spec.js";
import { readPlan } from "./plan-file.js";
import { readJson } from "./prepare-run.js";
import { createRunFolder, graphPaths, type RunFolder, removeLeftoverTemps, runFolder } from "./run-folder.js";
import { inRunFolder } from "./run-in-folder.js";
import { partFolder } from "./run-shard.js";
import type { ResolvedRunSpec } from "./run-spec.js";
import { outputsIntact } from "./save-graph.js";
import { partitionGraphs } from "./shard-plan.js";
import { readShardStatus } from "./shard-status.js";
import { settingsFingerprint } from "./spec-differences.js";

/** A shard the merge cannot use yet, and why. */
export interface UnfinishedShard {
  index: number;
  folder: string;
  /** Graphs of its share with a valid record, and its share. */
  done: number;
  graphs: number;
  /** How its last run ended, as it recorded (null: it never started, or was killed before saying). */
  state: string | null;
  message?: string;
}

/** Raised when shards are missing or unfinished; nothing was written. */
export class UnfinishedShardsError extends Error {
  override name = "UnfinishedShardsError";
  constructor(
    message: string,
    readonly shards: UnfinishedShard[],
  ) {
    super(message);
  }
}

const PART_NAME = /^(\d+)-of-(\d+)$/;

/**
 * `cliquescape merge RUN`: checks that every shard of the plan has a valid record (same input hash, same
 * settings, outputs whole) for every graph of its share, links (or copies) the per-graph files into the run
 * folder and writes the tables exactly as a single run does. When a shard is missing or unfinished it
 * names each one and writes nothing.
 */
export async function mergeParts(runRoot: string, shardCount?: number): Promise<ExtractResult> {
  const planned = runFolder(runRoot);
  if (!existsSync(planned.spec) || !existsSync(planned.marker))
    throw new UsageError(`${runRoot} has no spec.json: is it a run folder made with extract --plan?`);
  // Locked as a run is: a merge never runs beside a plan, another merge or a single run in the same folder.
  return inRunFolder(runRoot, "", async (folder) => merge(folder, runRoot, shardCount));
}

function merge(folder: RunFolder, runRoot: string, shardCount: number | undefined): ExtractResult {
  const plan = readPlan(runRoot);
  const spec = validateSpec(readJson(folder.spec), folder.spec) as ResolvedRunSpec;
  const fingerprint = settingsFingerprint(spec);
  if (plan.settings !== fingerprint)
    throw new UsageError(`${runRoot}: plan.json and spec.json disagree (made by different plans?)`);
  const count = shardCount ?? shardCountOf(runRoot);
  const parts = partitionGraphs(plan.graphs, count);

  const records = new Map<string, GraphRecord>();
  const unfinished: UnfinishedShard[] = [];
  parts.forEach((positions, index) => {
    const part = partFolder(runRoot, index, count);
    let done = 0;
    for (const i of positions) {
      const planned = plan.graphs[i];
      const record = readRecord(graphPaths(part, planned.id).record);
      if (
        record &&
        record.id === planned.id &&
        record.sha256 === planned.sha256 &&
        record.settings === fingerprint &&
        (!record.ok || outputsIntact(part, record, spec))
      ) {
        records.set(planned.id, record);
        done++;
      }
    }
    if (done < positions.length) {
      const status = existsSync(part.root) ? readShardStatus(part.root) : null;
      unfinished.push({
        index,
        folder: part.root,
        done,
        graphs: positions.length,
        state: existsSync(part.root) ? (status?.state ?? null) : "missing",
        ...(status?.message ? { message: status.message } : {}),
      });
    }
  });
  if (unfinished.length > 0) throw unfinishedError(runRoot, count, unfinished);

  createRunFolder(folder);
  removeLeftoverTemps(folder);
  parts.forEach((positions, index) => {
    const part = partFolder(runRoot, index, count);
    for (const i of positions) {
      const id = plan.graphs[i].id;
      const record = records.get(id)!;
      const from = graphPaths(part, id);
      const to = graphPaths(folder, id);
      // The single run's layout: a barcode and a bundle where the record says they were written.
      if (record.bytes?.barcode !== undefined) linkInto(from.barcode, to.barcode);
      if (record.bytes?.bundle !== undefined) linkInto(from.bundle, to.bundle);
      linkInto(from.record, to.record);
    }
  });
  return finishRun({
    folder,
    spec,
    entries: plan.graphs,
    records,
    problems: plan.problems,
    skipped: 0,
    interrupted: false,
  });
}

/** The shard count of the parts present; several counts (plans run with different N) must be chosen. */
function shardCountOf(runRoot: string): number {
  const partsRoot = join(runRoot, "parts");
  const names = existsSync(partsRoot) ? readdirSync(partsRoot) : [];
  const counts = new Set<number>();
  for (const name of names) {
    const match = PART_NAME.exec(name);
    if (match) counts.add(Number(match[2]));
  }
  if (counts.size === 0)
    throw new UsageError(
      `${runRoot}: no shard has run yet (no parts/I-of-N folder): run the shards first, or pass --shards N to list them all as missing`,
    );
  if (counts.size > 1)
    throw new UsageError(
      `${runRoot}/parts holds shards of ${counts.size} different counts (${[...counts].sort((a, b) => a - b).join(", ")}): pass --shards N`,
    );
  return [...counts][0];
}

function unfinishedError(runRoot: string, count: number, shards: UnfinishedShard[]): UnfinishedShardsError {
  const lines = shards.map((s) => {
    const why =
      s.state === "missing"
        ? "missing (never ran)"
        : `incomplete: ${s.done} of ${s.graphs} graphs done` +
          (s.state === "failed"
            ? `, it failed: ${s.message ?? "(no message)"}`
            : s.state === "interrupted"
              ? ", it was interrupted"
              : s.state === "running" || s.state === null
                ? ", it was stopped or is still running"
                : "");
    return `  shard ${s.index} (${s.folder}): ${why}`;
  });
  const indices = shards.map((s) => s.index).join(",");
  return new UnfinishedShardsError(
    `cannot merge ${runRoot}: ${shards.length} of ${count} shards not finished; nothing written:\n` +
      `${lines.join("\n")}\n` +
      `Run ${shards.length === 1 ? "that shard" : "those shards"} again (Slurm: sbatch --array=${indices} ${join(runRoot, "slurm", "shards.sbatch")}; ` +
      `by hand: extract … --shard I/${count}), then merge again. Finished graphs are not recomputed.`,
    shards,
  );
}

let counter = 0;

/**
 * Puts `from`'s bytes at `to` as a hard link (no copy of large bundles; the shard keeps its own name for
 * them, so re-running it still skips them), or as a copy where the file system has no hard links. Through
 * a temporary name and a rename, so `to` is never half there.
 */
function linkInto(from: string, to: string): void {
  try {
    const a = statSync(from);
    const b = statSync(to);
    if (a.ino === b.ino && a.dev === b.dev) return;
  } catch {
    // `to` is not there yet
  }
  const temporary = join(dirname(to), `.${basename(to)}.${process.pid}.x${counter++}.tmp`);
  try {
    linkSync(from, temporary);
  } catch {
    copyFileSync(from, temporary);
  }
  try {
    renameSync(temporary, to);
  } catch (error) {
    rmSync(temporary, { force: true });
    throw error;
  }
}

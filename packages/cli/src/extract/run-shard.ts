import { existsSync } from "node:fs";
import { join } from "node:path";
import { UsageError } from "../options/graph-options.js";
import { VERSION } from "../version.js";
import { computeGraphs } from "./compute-graphs.js";
import { hashInputs } from "./input-hashes.js";
import { validateSpec } from "./load-spec.js";
import { openRunDataset } from "./open-run-dataset.js";
import { readPlan } from "./plan-file.js";
import { readJson, SpecMismatchError } from "./prepare-run.js";
import type { ExtractRequest } from "./run-extract.js";
import { createRunFolder, removeLeftoverTemps, runFolder } from "./run-folder.js";
import { inRunFolder } from "./run-in-folder.js";
import type { ResolvedRunSpec } from "./run-spec.js";
import { partitionGraphs, shardName } from "./shard-plan.js";
import { writeShardStatus } from "./shard-status.js";
import { settingsFingerprint, specDifferences } from "./spec-differences.js";

export interface ShardResult {
  exitCode: number;
  graphs: number;
  done: number;
  failed: number;
  skipped: number;
}

/** The folder of shard I of N: parts/I-of-N inside the run folder, laid out as a run folder of its own. */
export function partFolder(runRoot: string, index: number, count: number) {
  return runFolder(join(runRoot, "parts", shardName(index, count)));
}

/**
 * `extract --shard I/N`: computes shard I's share of a planned run into parts/I-of-N, under the plan's spec
 * (a different spec is refused before any work). Graphs already done there are skipped, so a shard that
 * died is simply run again. Writes no file outside its part folder, so shards never write the same file.
 * Exit code 0 when the shard finished (failed graphs included: they go to errors.csv at the merge), 130
 * when it was interrupted.
 */
export async function runShard(
  request: ExtractRequest,
  shard: { index: number; count: number },
): Promise<ShardResult> {
  const root = runFolder(request.out);
  if (!existsSync(root.spec))
    throw new UsageError(
      `${request.out} has no spec.json: make the plan first with cliquescape extract DATASET --out ${request.out} --plan [options]`,
    );
  const plan = readPlan(root.root);
  const planned = validateSpec(readJson(root.spec), root.spec) as ResolvedRunSpec;
  const requested = validateSpec(request.spec, request.specSource);
  // What the shard was asked for, with what only the plan can know (grid, label codes, node layout) filled in.
  const asked = {
    ...requested,
    toolVersion: VERSION,
    resolvedGrid: requested.resolvedGrid ?? planned.resolvedGrid,
    labelNames: requested.labelNames ?? planned.labelNames,
    nodeLayout: requested.nodeLayout ?? planned.nodeLayout,
  };
  const differences = specDifferences(planned, asked);
  if (differences.length > 0)
    throw new SpecMismatchError(
      `shard ${shard.index}/${shard.count}: the settings differ from the plan in ${root.spec}; refusing to mix them:\n` +
        `${differences.map((line) => `  ${line}`).join("\n")}\n` +
        `Run every shard with --spec ${root.spec} (cliquescape cluster-script writes such commands).`,
    );
  // The time limit may differ (it changes no result); everything else is the plan's.
  const spec: ResolvedRunSpec = { ...planned, complex: requested.complex };
  const fingerprint = settingsFingerprint(spec);
  if (plan.settings !== fingerprint)
    throw new UsageError(
      `${root.root}: plan.json and spec.json disagree (made by different plans?): make the plan again with extract --plan`,
    );

  const { dataset, relativeFile } = openRunDataset(request.dataset, spec, request.datasetOptions);
  const ids = dataset.entries.map((e) => e.id);
  const differsAt = plan.graphs.findIndex((g, i) => ids[i] !== g.id);
  if (ids.length !== plan.graphs.length || differsAt >= 0) {
    const at = differsAt >= 0 ? differsAt : Math.min(ids.length, plan.graphs.length);
    throw new UsageError(
      `${request.dataset} is not the dataset of the plan in ${root.root}: ${ids.length} graphs now, ${plan.graphs.length} planned; ` +
        `first difference at graph ${at + 1} (${ids[at] ?? "none"} now, ${plan.graphs[at]?.id ?? "none"} planned). ` +
        "Make the plan again (extract --plan) into a new run folder.",
    );
  }
  const positions = partitionGraphs(plan.graphs, shard.count)[shard.index];
  const hashes = new Array<string>(ids.length).fill("");
  const mine = hashInputs(positions.map((i) => dataset.entries[i].file));
  positions.forEach((i, k) => {
    if (mine[k] !== plan.graphs[i].sha256)
      throw new UsageError(
        `${dataset.entries[i].file} changed since the plan (its sha256 differs from plan.json's): ` +
          "its features would not match the plan's grid and inputs. Make the plan again (extract --plan) into a new run folder.",
      );
    hashes[i] = mine[k];
  });

  // The shard's own folder, locked for it alone: shards of one run never wait for each other, and the same
  // shard started twice refuses at once.
  return inRunFolder(
    partFolder(root.root, shard.index, shard.count).root,
    request.dataset,
    async (part, kept) => {
      createRunFolder(part);
      removeLeftoverTemps(part);
      const name = `${shard.index}/${shard.count}`;
      const status = { shard: name, graphs: positions.length };
      writeShardStatus(part.root, { ...status, state: "running", done: 0, failed: 0 });
      try {
        const { records, skipped, stopped } = await computeGraphs({
          folder: part,
          entries: dataset.entries,
          positions,
          hashes,
          spec,
          fingerprint,
          relativeFile,
          workers: request.workers,
          signal: request.signal,
          kept,
        });
        const failed = [...records.values()].filter((r) => !r.ok).length;
        const state = stopped ? "interrupted" : "finished";
        writeShardStatus(part.root, { ...status, state, done: records.size, failed });
        process.stdout.write(
          `shard ${name} ${state}: ${records.size} of ${positions.length} graphs done` +
            `${skipped > 0 ? ` (${skipped} already done before this run)` : ""}, ${failed} failed` +
            ` (in errors.csv after the merge); files in ${part.root}\n` +
            (stopped
              ? "run this shard again to finish it\n"
              : `when every shard is finished: cliquescape merge ${root.root}\n`),
        );
        return {
          exitCode: stopped ? 130 : 0,
          graphs: positions.length,
          done: records.size,
          failed,
          skipped,
        };
      } catch (error) {
        const message = error instanceof Error ? error.message : String(error);
        try {
          writeShardStatus(part.root, { ...status, state: "failed", done: kept.graphs, failed: 0, message });
        } catch {
          // the folder cannot be written (the disk is full?): the error below says why
        }
        throw error;
      }
    },
  );
}

import { writeFileAtomic } from "@cliquescape/io";
import { encodePlan, PLAN_FORMAT, type PlanDocument, planPath } from "./plan-file.js";
import { prepareRun } from "./prepare-run.js";
import type { ExtractRequest } from "./run-extract.js";
import type { RunFolder } from "./run-folder.js";
import { inRunFolder } from "./run-in-folder.js";
import { estimatedCost, partitionGraphs } from "./shard-plan.js";
import { settingsFingerprint } from "./spec-differences.js";

/**
 * `extract --plan`: the step before shards. Fixes the spec and grid exactly as a single run would (so the
 * merged tables equal a single run's), writes spec.json, reads every graph once for its size and writes
 * plan.json with each graph's estimated cost. Computes no graph.
 */
export async function runPlan(request: ExtractRequest): Promise<PlanDocument> {
  return inRunFolder(request.out, request.dataset, (folder) => plan(request, folder));
}

async function plan(request: ExtractRequest, folder: RunFolder): Promise<PlanDocument> {
  const run = await prepareRun(request, folder, true);
  const sizes = run.sizes ?? [];
  const plan: PlanDocument = {
    format: PLAN_FORMAT,
    settings: settingsFingerprint(run.spec),
    workingDirectory: process.cwd(),
    dataset: request.dataset,
    datasetOptions: Object.fromEntries(
      Object.entries(request.datasetOptions ?? {}).filter(([, v]) => v !== undefined),
    ),
    graphs: run.dataset.entries.map((entry, i) => {
      const size = sizes[i] ?? null;
      return {
        id: entry.id,
        sha256: run.hashes[i],
        nodes: size?.nodes ?? null,
        edges: size?.edges ?? null,
        cost: estimatedCost(size, run.spec.complex.topDim),
      };
    }),
    problems: run.problems,
  };
  writeFileAtomic(planPath(run.folder.root), encodePlan(plan));
  const unreadable = plan.graphs.filter((g) => g.nodes === null).length;
  const example = (n: number) => {
    const parts = partitionGraphs(plan.graphs, n).map((p) => p.length);
    return `${n} shards: ${Math.min(...parts)}..${Math.max(...parts)} graphs each`;
  };
  process.stdout.write(
    `planned: ${plan.graphs.length} graphs${unreadable > 0 ? ` (${unreadable} could not be read: they fail in their shard and go to errors.csv)` : ""}; ` +
      `spec.json and plan.json written in ${run.folder.root}\n` +
      `balanced by estimated cost, e.g. ${example(2)}, ${example(4)}\n` +
      `next: cliquescape cluster-script ${run.folder.root} --shards N   (a Slurm array job and its merge)\n` +
      `  or, by hand: cliquescape extract ${request.dataset} --out ${run.folder.root} --spec ${run.folder.spec} --shard I/N` +
      ` for I = 0 .. N-1, then cliquescape merge ${run.folder.root}\n`,
  );
  return plan;
}

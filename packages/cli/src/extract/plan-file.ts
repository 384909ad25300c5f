import { readFileSync } from "node:fs";
import { join } from "node:path";
import type { OpenDatasetOptions } from "@cliquescape/io";
import { z } from "zod";
import { UsageError } from "../options/graph-options.js";
import type { ErrorRow } from "./assemble-tables.js";
import { describeIssues } from "./load-spec.js";

/**
 * /2: graphs of equal cost are dealt out in the order of a hash of their id, no longer by id (shard-plan.ts),
 * so shards and a merge of this version would not find the shares a /1 plan's shards computed.
 */
export const PLAN_FORMAT = "cliquescape-shard-plan/2";

/**
 * plan.json, written once by `extract --plan` beside spec.json: what every shard and the merge need besides
 * the spec. The graphs in dataset order with their input hashes and estimated costs (the partition into N
 * shards is computed from these, so it is the same for every shard and every re-run), and the manifest
 * rows that named no usable graph (errors.csv starts with them).
 */
export interface PlanDocument {
  format: typeof PLAN_FORMAT;
  /** The settings fingerprint of spec.json when the plan was made. */
  settings: string;
  /** The folder the plan was made from: job scripts run there, so relative paths mean the same. */
  workingDirectory: string;
  /** The dataset argument as typed, and the options that open it. */
  dataset: string;
  datasetOptions: OpenDatasetOptions;
  graphs: PlannedEntry[];
  problems: ErrorRow[];
}

export interface PlannedEntry {
  id: string;
  sha256: string;
  /** Nodes and edges after preparation (null: the graph could not be read); cost estimated from them. */
  nodes: number | null;
  edges: number | null;
  cost: number;
}

const PlanSchema = z.strictObject({
  format: z.literal(PLAN_FORMAT),
  settings: z.string(),
  workingDirectory: z.string(),
  dataset: z.string(),
  datasetOptions: z.strictObject({
    labelsFile: z.string().optional(),
    labelsColumn: z.string().optional(),
    coordinatesFile: z.string().optional(),
    variable: z.string().optional(),
  }),
  graphs: z.array(
    z.strictObject({
      id: z.string(),
      sha256: z.string(),
      nodes: z.number().int().nonnegative().nullable(),
      edges: z.number().int().nonnegative().nullable(),
      cost: z.number().nonnegative(),
    }),
  ),
  problems: z.array(
    z.strictObject({
      id: z.string(),
      file: z.string(),
      line: z.number().int().nullable(),
      column: z.number().int().nullable(),
      reason: z.string(),
    }),
  ),
});

export function planPath(runRoot: string): string {
  return join(runRoot, "plan.json");
}

/** plan.json: one graph per line, so a diff of two plans reads graph by graph. */
export function encodePlan(plan: PlanDocument): string {
  const { graphs, problems, ...head } = plan;
  const lines = [
    "{",
    ...Object.entries(head).map(([key, value]) => `  ${JSON.stringify(key)}: ${JSON.stringify(value)},`),
    `  "graphs": [${graphs.length === 0 ? "]," : ""}`,
    ...graphs.map((g, i) => `    ${JSON.stringify(g)}${i < graphs.length - 1 ? "," : ""}`),
    ...(graphs.length === 0 ? [] : ["  ],"]),
    `  "problems": ${JSON.stringify(problems)}`,
    "}",
  ];
  return `${lines.join("\n")}\n`;
}

/** Reads and checks plan.json of a run folder; a missing plan says how to make one. */
export function readPlan(runRoot: string): PlanDocument {
  const path = planPath(runRoot);
  let text: string;
  try {
    text = readFileSync(path, "utf8");
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    throw new UsageError(
      code === "ENOENT"
        ? `${runRoot} has no shard plan (${path}): make one first with cliquescape extract DATASET --out ${runRoot} --plan [options]`
        : `${path}: cannot read it (${code ?? error})`,
    );
  }
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    throw new UsageError(`${path}: not valid JSON (damaged? make the plan again with extract --plan)`);
  }
  const parsed = PlanSchema.safeParse(value);
  if (!parsed.success)
    throw new UsageError(`${path}: not a shard plan of this version\n${describeIssues(parsed.error.issues)}`);
  return parsed.data as PlanDocument;
}

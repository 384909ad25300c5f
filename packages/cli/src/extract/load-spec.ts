import { readFileSync } from "node:fs";
import type { z } from "zod";
import { UsageError } from "../options/graph-options.js";
import { type RunSpec, type RunSpecInput, RunSpecSchema } from "./run-spec.js";

/**
 * Reads a spec file as plain JSON (not yet validated: options are laid over it first). A missing file or
 * broken JSON is a usage error naming the file and, for JSON, the line and column.
 */
export function readSpecFile(file: string): Record<string, unknown> {
  let text: string;
  try {
    text = readFileSync(file, "utf8");
  } catch (error) {
    throw new UsageError(
      `--spec ${file}: cannot read it (${(error as NodeJS.ErrnoException).code ?? error})`,
    );
  }
  try {
    const value = JSON.parse(text) as unknown;
    if (value === null || typeof value !== "object" || Array.isArray(value)) {
      throw new UsageError(`${file}: a run spec is a JSON object`);
    }
    return value as Record<string, unknown>;
  } catch (error) {
    if (error instanceof UsageError) throw error;
    throw new UsageError(`${file}${jsonErrorPosition(text, (error as Error).message)}: not valid JSON`);
  }
}

/** Validates a spec; every problem is listed with its JSON path (e.g. `complex.topDim`). */
export function validateSpec(raw: RunSpecInput | Record<string, unknown>, source: string): RunSpec {
  const parsed = RunSpecSchema.safeParse(raw);
  if (parsed.success) return parsed.data;
  throw new UsageError(`${source}: invalid run spec\n${describeIssues(parsed.error.issues)}`);
}

export function describeIssues(issues: readonly z.core.$ZodIssue[]): string {
  return issues
    .map(
      (issue) => `  at ${issue.path.length === 0 ? "(top level)" : issue.path.join(".")}: ${issue.message}`,
    )
    .join("\n");
}

/** ": line 3, column 14" from V8's "… at position 41 …" message, when it gives one. */
function jsonErrorPosition(text: string, message: string): string {
  const match = /position (\d+)/.exec(message);
  if (!match) return "";
  const offset = Number(match[1]);
  const before = text.slice(0, offset);
  const line = before.split("\n").length;
  const column = offset - before.lastIndexOf("\n");
  return `:${line}:${column}`;
}

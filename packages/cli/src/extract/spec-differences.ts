import { createHash } from "node:crypto";
import type { RunSpec } from "./run-spec.js";

/** Parts of a spec that decide what a per-graph result holds; results made under different ones never mix. */
const COMPARED_KEYS = [
  "format",
  "toolVersion",
  "connectivity",
  "preparation",
  "complex",
  "grid",
  "resolvedGrid",
  "nodeFeatures",
  "families",
  "vectorisation",
  "nullScores",
  "outputs",
  "labelNames",
  "nodeLayout",
] as const;

/**
 * The settings in which two specs differ, as "path: before → now" lines (empty when they agree).
 * Provenance (dataset, inputs) is not compared: new files are handled graph by graph through their hashes.
 */
export function specDifferences(before: Partial<RunSpec>, now: Partial<RunSpec>): string[] {
  const lines: string[] = [];
  for (const key of COMPARED_KEYS) collect(key, compared(before, key), compared(now, key), lines);
  return lines;
}

/**
 * A compared part of the spec without the settings that change no result, so a run may go on under
 * another value of them (a longer time limit, say).
 */
function compared(spec: Partial<RunSpec>, key: (typeof COMPARED_KEYS)[number]): unknown {
  const value: unknown = spec[key];
  if (key !== "complex" || !isPlainObject(value)) return value;
  const { timeLimitSeconds: _, ...rest } = value;
  return rest;
}

function collect(path: string, a: unknown, b: unknown, out: string[]): void {
  if (isPlainObject(a) && isPlainObject(b)) {
    const keys = [...new Set([...Object.keys(a), ...Object.keys(b)])].sort();
    for (const key of keys) collect(`${path}.${key}`, a[key], b[key], out);
    return;
  }
  if (JSON.stringify(a) !== JSON.stringify(b)) out.push(`${path}: ${show(a)} → ${show(b)}`);
}

function show(value: unknown): string {
  if (value === undefined) return "(unset)";
  const text = JSON.stringify(value);
  return text.length > 80 ? `${text.slice(0, 77)}...` : text;
}

function isPlainObject(value: unknown): value is Record<string, unknown> {
  return value !== null && typeof value === "object" && !Array.isArray(value);
}

/** A short hash of the compared settings: per-graph records carry it, so a stray record never mixes in. */
export function settingsFingerprint(spec: Partial<RunSpec>): string {
  // Sections a spec may lack keep the fingerprint it had before they existed: connectivity (no recordings)
  // and nullScores (no z-scored columns).
  const keys = COMPARED_KEYS.filter(
    (key) =>
      (key !== "connectivity" || spec.connectivity !== undefined) &&
      (key !== "nullScores" || Boolean(spec.nullScores?.model)),
  );
  const picked = keys.map((key) => [key, compared(spec, key) ?? null]);
  return createHash("sha256").update(JSON.stringify(picked)).digest("hex").slice(0, 16);
}

import type { GraphRecord } from "./graph-record.js";
import { recordValues } from "./graph-record.js";

/** Columns shown in the closing summary, when the run has them: loops, Euler curve, persistence of loops. */
export const HEADLINE_FEATURES = ["betti_d1_max", "euler_area", "bars_d1_total_persistence"] as const;

export interface LabelMeans {
  features: string[];
  rows: { label: string; graphs: number; means: number[] }[];
}

/** Mean of each headline feature per label (labels in code order, unlabelled graphs last as "(none)"). */
export function labelMeans(
  records: readonly GraphRecord[],
  featureNames: readonly string[],
  labelNames: readonly string[],
): LabelMeans {
  const features = HEADLINE_FEATURES.filter((name) => featureNames.includes(name));
  const columns = features.map((name) => featureNames.indexOf(name));
  const groups = new Map<string, number[][]>();
  for (const record of records) {
    if (!record.ok) continue;
    const label = record.label ?? "(none)";
    const values = recordValues(record);
    if (!groups.has(label)) groups.set(label, []);
    groups.get(label)!.push(columns.map((c) => values[c]));
  }
  const order = [...labelNames, "(none)"].filter((label) => groups.has(label));
  const rows = order.map((label) => {
    const members = groups.get(label)!;
    const means = columns.map((_, j) => members.reduce((sum, row) => sum + row[j], 0) / members.length);
    return { label, graphs: members.length, means };
  });
  return { features, rows };
}

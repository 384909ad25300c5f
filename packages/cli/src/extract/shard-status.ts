import { readFileSync } from "node:fs";
import { join } from "node:path";
import { writeFileAtomic } from "@cliquescape/io";

/**
 * status.json in a shard's part folder: how its last run ended, for the merge's report. A shard killed
 * outright leaves "running"; the merge then goes by the graph records alone, which are what count.
 */
export interface ShardStatus {
  shard: string;
  state: "running" | "finished" | "interrupted" | "failed";
  graphs: number;
  done: number;
  failed: number;
  message?: string;
}

export function statusPath(partRoot: string): string {
  return join(partRoot, "status.json");
}

export function writeShardStatus(partRoot: string, status: ShardStatus): void {
  writeFileAtomic(statusPath(partRoot), `${JSON.stringify(status, null, 2)}\n`);
}

/** The shard's status, or null when it has none (never started) or it cannot be read. */
export function readShardStatus(partRoot: string): ShardStatus | null {
  try {
    return JSON.parse(readFileSync(statusPath(partRoot), "utf8")) as ShardStatus;
  } catch {
    return null;
  }
}

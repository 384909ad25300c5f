import type { Dataset } from "@cliquescape/io";
import type { GraphFailure } from "./graph-failure.js";
import { runOnWorkers } from "./graph-pool.js";
import { InterruptedError } from "./interrupted-error.js";
import { noEdgeError } from "./no-edge-error.js";
import { startProgress } from "./progress.js";
import type { RunSpec } from "./run-spec.js";
import type { GraphSize } from "./worker-messages.js";

/** All edge values the first pass may hold at once, over the whole dataset (128 MiB of float64). */
const FIRST_PASS_VALUES = 2 ** 24;

export interface PassOptions {
  workers: number;
  signal: AbortSignal;
}

/**
 * Reads every graph once (on the workers) and returns a bounded sample of all their edge values. When no
 * graph gives an edge, fails with the graphs' own reasons (a NoEdgeError).
 */
export async function firstPass(
  spec: RunSpec,
  dataset: Dataset,
  request: PassOptions,
): Promise<Float64Array> {
  const { sample, failures } = await readingPass(spec, dataset, request, true);
  if (sample.length === 0) throw noEdgeError(dataset.entries, failures);
  return sample;
}

export interface PassResult {
  /** The edge-value sample, in dataset order (empty when not asked for). */
  sample: Float64Array;
  /** Each graph's size after preparation, null where it could not be read. */
  sizes: (GraphSize | null)[];
  failures: (GraphFailure | null)[];
}

/**
 * Reads and prepares every graph once on the workers: their sizes and, with `sampling`, the same bounded
 * sample of edge values the first pass takes (so a shard plan fixes the very grid a single run would).
 */
export async function readingPass(
  spec: RunSpec,
  dataset: Dataset,
  request: PassOptions,
  sampling: boolean,
): Promise<PassResult> {
  const entries = dataset.entries;
  const limit = sampling ? Math.max(1, Math.floor(FIRST_PASS_VALUES / Math.max(1, entries.length))) : 0;
  const parts: Float64Array[] = [];
  const sizes: (GraphSize | null)[] = entries.map(() => null);
  const failures: (GraphFailure | null)[] = entries.map(() => null);
  let failed = 0;
  let done = 0;
  const progress = startProgress(
    sampling ? "first pass (weight quantiles)" : "reading every graph (sizes)",
    entries.length,
  );
  const ended = await runOnWorkers(
    entries.map((entry, index) => ({ kind: "sample" as const, index, entry, limit })),
    (reply) => {
      if (reply.kind !== "sample") return;
      done++;
      sizes[reply.index] = reply.size;
      if (reply.values) parts[reply.index] = reply.values;
      else {
        failed++;
        failures[reply.index] = reply.failure;
      }
      progress.update(done, failed);
    },
    {
      size: Math.max(1, Math.min(request.workers, entries.length)),
      setup: { kind: "setup", preparation: spec.preparation, connectivity: spec.connectivity, spec: null },
      signal: request.signal,
      timeLimitSeconds: spec.complex.timeLimitSeconds,
      // A graph that cannot be read here fails again, with its reason, when it is computed.
      failedReply: (task, message) => ({
        kind: "sample",
        index: task.index,
        values: null,
        size: null,
        failure: { file: task.entry.file, line: null, column: null, reason: message, kind: "WorkerError" },
      }),
    },
  );
  progress.stop();
  if (ended === "stopped")
    throw new InterruptedError("interrupted during the first pass; nothing was computed");
  // Dataset order, whatever order the workers answered in: the quantiles do not depend on scheduling.
  const total = parts.reduce((sum, part) => sum + (part?.length ?? 0), 0);
  const sample = new Float64Array(total);
  let at = 0;
  for (const part of parts) {
    if (!part) continue;
    sample.set(part, at);
    at += part.length;
  }
  return { sample, sizes, failures };
}

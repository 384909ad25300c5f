import { mkdirSync, rmSync } from "node:fs";
import { dirname, join, relative, sep } from "node:path";
import {
  encodeCsv,
  encodeNpy,
  type OpenDatasetOptions,
  openTimeSeriesDataset,
  writeFileAtomic,
} from "@cliquescape/io";
import { type ErrorRow, errorRow, problemRow } from "../extract/assemble-tables.js";
import { hashInputs } from "../extract/input-hashes.js";
import { startProgress } from "../extract/progress.js";
import { fileStem } from "../extract/run-folder.js";
import { UsageError } from "../options/graph-options.js";
import { runOnWorkerScript } from "../parallel/worker-pool.js";
import { VERSION } from "../version.js";
import { claimConnectFolder } from "./connect-folder.js";
import type { ConnectReply, ConnectSetup, ConnectTask } from "./connect-messages.js";
import { type ConnectivitySpec, describeMeasure } from "./connectivity-spec.js";
import { StackCollector } from "./stack-collector.js";

/** One (k, n, n) .npy stack with ids.txt, or one .npy per recording with a manifest. */
export type MatrixLayout = "stack" | "files";

export interface ConnectRequest {
  dataset: string;
  out: string;
  workers: number;
  connectivity: ConnectivitySpec;
  layout: MatrixLayout;
  datasetOptions: OpenDatasetOptions;
  signal: AbortSignal;
}

export interface ConnectResult {
  exitCode: number;
  written: number;
  failed: number;
  interrupted: boolean;
}

/** What is kept of each recording once its matrix is written or stacked. */
interface Outcome {
  ok: boolean;
  channels: number | null;
  timePoints: number | null;
  isolated: number[];
  shrinkage: number | null;
  labels: string[] | null;
  warnings: string[];
  error: ErrorRow | null;
}

const WORKER_SCRIPT = new URL("./connect-worker.js", import.meta.url);

/**
 * The connect job: every recording of a dataset to its connectivity matrix, on worker threads, written as
 * one stack (dataset order, failed recordings left out) or one file per recording, with a table of every
 * recording's quality notes (subjects.csv), the failures (errors.csv) and the settings and input hashes
 * (connect.json).
 */
export async function runConnect(request: ConnectRequest): Promise<ConnectResult> {
  const { connectivity } = request;
  const dataset = openTimeSeriesDataset(request.dataset, {
    ...request.datasetOptions,
    channelsFirst: connectivity.channelsFirst,
    ...(connectivity.channels === null ? {} : { channels: connectivity.channels }),
  });
  const base = dataset.kind === "folder" ? dataset.root : dirname(dataset.root);
  const relativeFile = (file: string) => relative(base, file).split(sep).join("/");
  const problems = dataset.problems.map((p) => problemRow(p, relativeFile(p.file)));
  if (dataset.entries.length === 0) {
    throw new UsageError(
      `${request.dataset} names no usable recording:\n${problems.map((p) => `  ${p.reason}`).join("\n")}`,
    );
  }
  const entries = dataset.entries;
  const hashes = hashInputs(entries.map((entry) => entry.file));
  const lock = claimConnectFolder(
    request.out,
    request.dataset,
    base,
    entries.map((entry) => entry.file),
  );
  try {
    // Outputs of an earlier run that this one may not rewrite must not pass for its own.
    for (const name of ["matrices.npy", "ids.txt", "labels.txt", "channels.txt", "manifest.csv"]) {
      rmSync(join(request.out, name), { force: true });
    }
    const matricesFolder = join(request.out, "matrices");

    const outcomes: (Outcome | undefined)[] = new Array(entries.length);
    const collector =
      request.layout === "stack" ? new StackCollector(entries.length, connectivity.channels) : null;
    let failed = 0;
    let done = 0;
    const progress = startProgress(
      `connectivity (${describeMeasure(connectivity)})`,
      entries.length,
      process.stderr,
      "recordings",
    );
    const ended = await runOnWorkerScript<ConnectTask, ConnectReply, ConnectSetup>(
      WORKER_SCRIPT,
      entries.map((entry, index) => ({ kind: "connect", index, entry })),
      (reply) => {
        const entry = entries[reply.index];
        if (!reply.ok) {
          collector?.fail(reply.index);
          const failure = { ...reply.failure, file: relativeFile(reply.failure.file) };
          outcomes[reply.index] = { ...emptyOutcome(reply.warnings), error: errorRow(entry.id, failure) };
          failed++;
        } else {
          if (collector) collector.add(reply.index, reply.n, reply.values);
          else {
            mkdirSync(matricesFolder, { recursive: true });
            writeFileAtomic(
              join(matricesFolder, `${fileStem(entry.id)}.npy`),
              encodeNpy(reply.values, [reply.n, reply.n]),
            );
          }
          outcomes[reply.index] = {
            ok: true,
            channels: reply.n,
            timePoints: reply.timePoints,
            isolated: reply.isolated,
            shrinkage: reply.shrinkage,
            labels: reply.labels,
            warnings: reply.warnings,
            error: null,
          };
        }
        progress.update(++done, failed);
      },
      {
        size: Math.max(1, Math.min(request.workers, entries.length)),
        setup: { kind: "setup", connectivity },
        signal: request.signal,
        timeLimitSeconds: null,
        failedReply: (task, message) => ({
          kind: "connect",
          index: task.index,
          ok: false,
          failure: { file: task.entry.file, line: null, column: null, reason: message, kind: "WorkerError" },
          warnings: [],
        }),
      },
    );
    progress.stop();

    // Matrices of another size than the stack's are failures too, with their reason.
    let written: number[] = [];
    if (collector) {
      const stack = collector.finish();
      for (const [index, reason] of collector.refused) {
        const outcome = outcomes[index] as Outcome;
        outcome.ok = false;
        outcome.error = {
          id: entries[index].id,
          file: relativeFile(entries[index].file),
          line: null,
          column: null,
          reason,
        };
      }
      written = stack.slots;
      if (stack.bytes) writeFileAtomic(join(request.out, "matrices.npy"), stack.bytes);
      writeFileAtomic(join(request.out, "ids.txt"), lines(written.map((k) => entries[k].id)));
      if (written.some((k) => entries[k].label !== null)) {
        writeFileAtomic(join(request.out, "labels.txt"), lines(written.map((k) => entries[k].label ?? "")));
      }
    } else {
      written = outcomes.flatMap((o, k) => (o?.ok ? [k] : []));
      writeFileAtomic(
        join(request.out, "manifest.csv"),
        encodeCsv(
          ["id", "file", "label", "split", "directed"],
          written.map((k) => [
            entries[k].id,
            `matrices/${fileStem(entries[k].id)}.npy`,
            entries[k].label,
            entries[k].split,
            connectivity.measure === "lagged",
          ]),
        ),
      );
    }
    const channelNames = written.map((k) => outcomes[k]?.labels).find((labels) => labels);
    if (channelNames) {
      writeFileAtomic(join(request.out, "channels.txt"), lines(channelNames));
      for (const k of written) {
        const labels = outcomes[k]?.labels;
        if (labels && labels.join("\n") !== channelNames.join("\n")) {
          outcomes[k]?.warnings.push(
            "channel names differ from those in channels.txt (the first recording's)",
          );
        }
      }
    }
    const errors = [...problems, ...outcomes.flatMap((o) => (o?.error ? [o.error] : []))];
    writeFileAtomic(join(request.out, "errors.csv"), errorsCsv(errors));
    writeFileAtomic(join(request.out, "subjects.csv"), subjectsCsv(entries, outcomes, relativeFile));
    writeFileAtomic(
      join(request.out, "connect.json"),
      `${JSON.stringify(
        {
          format: "cliquescape-connect/1",
          toolVersion: VERSION,
          connectivity,
          layout: request.layout,
          dataset: request.dataset,
          ...(Object.values(request.datasetOptions).some((v) => v !== undefined)
            ? { datasetOptions: request.datasetOptions }
            : {}),
          inputs: entries.map((entry, k) => ({
            id: entry.id,
            file: relativeFile(entry.file),
            sha256: hashes[k],
          })),
        },
        null,
        2,
      )}\n`,
    );

    const interrupted = ended === "stopped";
    const left = entries.length - written.length;
    const warned = outcomes.filter((o) => o?.ok && o.warnings.length > 0).length;
    const where = request.layout === "stack" ? "matrices.npy (ids.txt)" : "matrices/ (manifest.csv)";
    const to = written.length > 0 ? ` → ${join(request.out, where)}` : ", no matrix written";
    process.stdout.write(
      `connect: ${written.length} of ${entries.length} recordings${to}, ${describeMeasure(connectivity)}` +
        `${left > 0 ? `; ${left} left out${interrupted ? " (interrupted)" : ""}: see errors.csv` : ""}` +
        `${warned > 0 ? `; ${warned} with warnings: see subjects.csv` : ""}\n`,
    );
    return {
      exitCode: interrupted ? 130 : errors.length > 0 ? 1 : 0,
      written: written.length,
      failed: left,
      interrupted,
    };
  } finally {
    lock.release();
  }
}

function emptyOutcome(warnings: string[]): Outcome {
  return {
    ok: false,
    channels: null,
    timePoints: null,
    isolated: [],
    shrinkage: null,
    labels: null,
    warnings,
    error: null,
  };
}

function lines(values: readonly string[]): string {
  return values.length === 0 ? "" : `${values.join("\n")}\n`;
}

function errorsCsv(errors: readonly ErrorRow[]): string {
  return encodeCsv(
    ["id", "file", "line", "column", "reason"],
    errors.map((e) => [e.id, e.file, e.line, e.column, e.reason]),
  );
}

/** One row per recording, in dataset order: what it gave, and every note about its quality. */
function subjectsCsv(
  entries: readonly { id: string; file: string }[],
  outcomes: readonly (Outcome | undefined)[],
  relativeFile: (file: string) => string,
): string {
  return encodeCsv(
    ["id", "file", "status", "channels", "time_points", "isolated_channels", "shrinkage", "warnings"],
    entries.map((entry, k) => {
      const o = outcomes[k];
      const status = !o ? "not run" : o.ok ? "ok" : "failed";
      return [
        entry.id,
        relativeFile(entry.file),
        status,
        o?.channels,
        o?.timePoints,
        o?.isolated.join(" "),
        o?.shrinkage,
        o?.warnings.join(" | "),
      ];
    }),
  );
}

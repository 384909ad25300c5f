import { describeStage, type WorkControl, type WorkProgress } from "@cliquescape/core";

/** A computation shorter than this prints no progress at all. */
const QUIET_MS = 2000;
/** Off a terminal, one plain line this often at most. */
const PLAIN_INTERVAL_MS = 5000;

/** The clock of one graph's computations: a shared time limit and a progress line on stderr. */
export interface GraphWork {
  /** Hand this to every core computation of the graph: they share one limit and one line. */
  readonly control: WorkControl;
  /** Ends the progress display (clears the live line on a terminal). */
  stop(): void;
}

/**
 * Starts the clock for one graph. After the first two seconds, progress (stage, dimension, how many done)
 * shows as a live line when `stream` is a terminal, and as a plain line every five seconds otherwise.
 */
export function startGraphWork(
  label: string,
  timeLimitSeconds: number | null,
  stream: NodeJS.WriteStream = process.stderr,
): GraphWork {
  const startedAt = Date.now();
  let live = false;
  let lastPlain = 0;
  const onProgress = (p: WorkProgress) => {
    if (p.elapsedMs < QUIET_MS) return;
    const line = `cliquescape: ${label}: ${progressLine(p)}`;
    if (stream.isTTY) {
      stream.write(`\r\x1b[K${line}`);
      live = true;
    } else if (p.elapsedMs - lastPlain >= PLAIN_INTERVAL_MS) {
      lastPlain = p.elapsedMs;
      stream.write(`${line}\n`);
    }
  };
  return {
    control: {
      startedAt,
      onProgress,
      progressIntervalMs: stream.isTTY ? 250 : 1000,
      ...(timeLimitSeconds === null ? {} : { timeLimitMs: timeLimitSeconds * 1000 }),
    },
    stop() {
      if (live) stream.write("\r\x1b[K");
      live = false;
    },
  };
}

/** "reducing columns of dimension 2: 1,200 of 4,000 (31 s)". */
export function progressLine(p: WorkProgress): string {
  const stage = p.stage === "counting simplices" ? "counting simplices (root vertices)" : describeStage(p);
  const done = p.done.toLocaleString("en-US");
  const count = Number.isFinite(p.total) ? `${done} of ${p.total.toLocaleString("en-US")}` : `${done} so far`;
  return `${stage}: ${count} (${Math.round(p.elapsedMs / 1000)} s)`;
}

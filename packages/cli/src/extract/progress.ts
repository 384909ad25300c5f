import cliProgress from "cli-progress";

/** Progress of one phase (first pass, graphs) on stderr. */
export interface Progress {
  /** `working`: what the longest-running graph in flight is doing, when it has run a while. */
  update(done: number, failed: number, working?: string): void;
  stop(): void;
}

const PLAIN_INTERVAL_MS = 5000;

/**
 * A bar with done/total, rate and time left when stderr is a terminal; otherwise one plain line every few
 * seconds (logs and CI stay readable), and nothing at all for a phase that ends sooner.
 */
export function startProgress(
  phase: string,
  total: number,
  stream: NodeJS.WriteStream = process.stderr,
  unit = "graphs",
): Progress {
  if (stream.isTTY) return barProgress(phase, total, stream);
  return plainProgress(phase, total, stream, unit);
}

function barProgress(phase: string, total: number, stream: NodeJS.WriteStream): Progress {
  const bar = new cliProgress.SingleBar(
    {
      stream,
      format: `${phase} [{bar}] {value}/{total} | {rate}/s | {eta_formatted} left | failed {failed}{working}`,
      etaBuffer: 50,
      hideCursor: true,
      clearOnComplete: false,
    },
    cliProgress.Presets.shades_classic,
  );
  const started = Date.now();
  bar.start(total, 0, { rate: "–", failed: 0, working: "" });
  const width = Math.max(20, (stream.columns ?? 120) - 90);
  return {
    update(done, failed, working) {
      const text = working
        ? ` | ${working.length > width ? `${working.slice(0, width - 1)}…` : working}`
        : "";
      bar.update(done, { rate: rateOf(done, started), failed, working: text });
    },
    stop() {
      bar.stop();
    },
  };
}

function plainProgress(phase: string, total: number, stream: NodeJS.WriteStream, unit: string): Progress {
  const started = Date.now();
  let lastLine = started;
  return {
    update(done, failed, working) {
      const now = Date.now();
      if (now - lastLine < PLAIN_INTERVAL_MS) return;
      lastLine = now;
      const rate = done / ((now - started) / 1000);
      const left = rate > 0 ? formatDuration((total - done) / rate) : "?";
      stream.write(
        `cliquescape: ${phase}: ${done}/${total} ${unit}, ${failed} failed, ${rate.toFixed(1)} ${unit}/s, about ${left} left${working ? `; ${working}` : ""}\n`,
      );
    },
    stop() {},
  };
}

function rateOf(done: number, started: number): string {
  const seconds = (Date.now() - started) / 1000;
  return seconds > 0 ? (done / seconds).toFixed(1) : "–";
}

export function formatDuration(seconds: number): string {
  const s = Math.round(seconds);
  if (s < 60) return `${s}s`;
  const m = Math.floor(s / 60);
  if (m < 60) return `${m}m${String(s % 60).padStart(2, "0")}s`;
  return `${Math.floor(m / 60)}h${String(m % 60).padStart(2, "0")}m`;
}

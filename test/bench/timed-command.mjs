// Shared by the benchmarks that run the command line: reading their options, and timing one command.
import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { loadavg } from "node:os";

/** `option(name, fallback)`: the value after `name` in `args`, or the fallback. */
export function optionReader(args) {
  return (name, fallback) => {
    const i = args.indexOf(name);
    return i >= 0 && i + 1 < args.length ? args[i + 1] : fallback;
  };
}

/**
 * Runs `command args` under /usr/bin/time, writing its report to `timeFile`: wall seconds, CPU seconds (user
 * + system of the whole process, every thread), peak memory (maximum resident set size, MiB), the 1-minute
 * load average right after, and the command's stdout (a Buffer). stderr passes through; `env` is added to
 * the environment. Throws naming the exit status when the command fails.
 */
export function timedCommand(command, args, timeFile, env = {}) {
  let stdout;
  try {
    stdout = execFileSync("/usr/bin/time", ["-f", "%e %M %U %S", "-o", timeFile, command, ...args], {
      env: { ...process.env, ...env },
      stdio: ["ignore", "pipe", "inherit"],
      maxBuffer: 1 << 30,
    });
  } catch (error) {
    throw new Error(`exit ${error.status}`);
  }
  const [seconds, maxRssKiB, user, system] = readFileSync(timeFile, "utf8")
    .trim()
    .split("\n")
    .pop()
    .split(" ")
    .map(Number);
  return { seconds, cpuSeconds: user + system, peakMiB: maxRssKiB / 1024, load: loadavg()[0], stdout };
}

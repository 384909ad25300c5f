/**
 * Runs Debian's python3 with general-purpose libraries (networkx, numpy) as an outside reference.
 * Tests that need a module skip, with the reason in their name, only when that module is missing — except
 * under CI, which installs them: there a missing module is a failure, so a reference check never goes quiet.
 */
import { spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import { appendFileSync, existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { expect } from "vitest";

// Debian's interpreter sees Debian's python3-* packages; a `python3` earlier on PATH (pyenv, venv) may not.
export const PYTHON = process.env.PYTHON ?? (existsSync("/usr/bin/python3") ? "/usr/bin/python3" : "python3");

/**
 * null when every module imports, otherwise a message saying what is missing and how to get it. A miss is
 * also logged for the line that ends `npm test` (test/support/python-skips-reporter.ts), so call this from
 * the test file whose checks it skips.
 */
export function missingPythonModules(modules: string[]): string | null {
  const cached = cacheFile("modules", () => modules.join(","));
  if (cached && existsSync(cached)) return null;
  const probe = spawnSync(PYTHON, ["-c", modules.map((m) => `import ${m}`).join("; ")], { encoding: "utf8" });
  const missing = probe.error
    ? `${PYTHON} not found (${probe.error.message})`
    : probe.status !== 0
      ? `python module missing: ${modules.join(", ")} (apt-get install -y ${modules.map((m) => `python3-${m}`).join(" ")})`
      : null;
  if (missing && process.env.CI)
    throw new Error(`${missing}; .ci/run installs it, so this is a CI setup fault`);
  const log = process.env.CLIQUESCAPE_PYTHON_SKIPS;
  if (missing && log)
    appendFileSync(log, `${JSON.stringify({ file: expect.getState().testPath, modules })}\n`);
  if (cached && !missing) writeWhole(cached, "");
  return missing;
}

/** Runs test/support/python/<script> with `input` as JSON on stdin; returns its JSON stdout. */
export function runPythonScript<T>(script: string, input: unknown): T {
  const path = fileURLToPath(new URL(`./python/${script}`, import.meta.url));
  const stdin = JSON.stringify(input);
  const cached = cacheFile("answer", () => `${readFileSync(path, "utf8")}\0${stdin}`);
  if (cached && existsSync(cached)) return JSON.parse(readFileSync(cached, "utf8")) as T;
  const run = spawnSync(PYTHON, [path], {
    input: stdin,
    encoding: "utf8",
    maxBuffer: 64 << 20,
  });
  if (run.error) throw run.error;
  if (run.status !== 0) throw new Error(`${script} failed (exit ${run.status}):\n${run.stderr}`);
  const answer = JSON.parse(run.stdout) as T;
  if (cached) writeWhole(cached, run.stdout);
  return answer;
}

/**
 * Mutation runs (vitest.mutation.config.ts) set CLIQUESCAPE_PYTHON_CACHE to a folder: Python's answer
 * depends only on the script and its input, never on the mutant, so it is asked once per run instead of
 * once per mutant. `npm test` leaves it unset and asks Python every time.
 */
function cacheFile(kind: string, key: () => string): string | null {
  const dir = process.env.CLIQUESCAPE_PYTHON_CACHE;
  if (!dir) return null;
  mkdirSync(dir, { recursive: true });
  return join(dir, `${kind}-${createHash("sha256").update(key()).digest("hex")}.json`);
}

// Written aside and renamed, so a test process stopped midway never leaves half an answer.
function writeWhole(file: string, text: string): void {
  const aside = `${file}.${process.pid}.tmp`;
  writeFileSync(aside, text);
  renameSync(aside, file);
}

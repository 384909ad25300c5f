/**
 * The CLI's worker pool as `distances` and `nullmodel` use it (mapOnWorkers over the pool of
 * worker-pool.ts), on the built package: every task answered once, the setup seen by every worker, an error
 * a task throws stopping the run with its name and message, and a worker that dies failing the run instead
 * of hanging it. The worker scripts are written to a temporary folder and import the built module.
 */
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { pathToFileURL } from "node:url";
import { describe, expect, it } from "vitest";

const built = pathToFileURL(join(process.cwd(), "packages/cli/dist/parallel/map-on-workers.js")).href;
const { mapOnWorkers } = (await import(built)) as {
  mapOnWorkers: <Task, Reply>(
    script: URL,
    setup: unknown,
    tasks: readonly Task[],
    size: number,
    onReply: (reply: Reply) => void,
  ) => Promise<void>;
};

/** A worker script answering each task with `body` (a function of setup and task), in a temporary file. */
function workerScript(body: string): URL {
  const folder = mkdtempSync(join(tmpdir(), "cliquescape-pool-"));
  const file = join(folder, "worker.mjs");
  writeFileSync(
    file,
    `import { parentPort } from "node:worker_threads";\n` +
      `import { serveTasks } from ${JSON.stringify(built)};\n` +
      `serveTasks(parentPort, (setup, task) => { ${body} });\n`,
  );
  return pathToFileURL(file);
}

/** The error that mapOnWorkers ends with on tasks 0 … count − 1 and two workers (an Error, or the test fails). */
async function failureOf(script: URL, count: number): Promise<Error> {
  const outcome = await mapOnWorkers(
    script,
    null,
    Array.from({ length: count }, (_, i) => i),
    2,
    () => {},
  ).catch((e: unknown) => e);
  expect(outcome).toBeInstanceOf(Error);
  return outcome as Error;
}

describe("mapOnWorkers", () => {
  it("answers every task once, each with the setup its worker was given", async () => {
    const script = workerScript("return { reply: { task, value: task * setup.factor } };");
    const tasks = Array.from({ length: 1000 }, (_, i) => i);
    const replies: { task: number; value: number }[] = [];
    await mapOnWorkers(script, { factor: 3 }, tasks, 2, (reply: { task: number; value: number }) =>
      replies.push(reply),
    );
    replies.sort((a, b) => a.task - b.task);
    expect(replies.map((r) => r.task)).toEqual(tasks);
    expect(replies.every((r) => r.value === 3 * r.task)).toBe(true);
  });

  it("moves transferred buffers to the main thread intact", async () => {
    const script = workerScript(
      "const values = new Float64Array(4).fill(task); return { reply: values, transfer: [values.buffer] };",
    );
    const replies: Float64Array[] = [];
    await mapOnWorkers(script, null, [1, 2, 3], 1, (reply: Float64Array) => replies.push(reply));
    expect(replies.map((r) => Array.from(r))).toEqual([
      [1, 1, 1, 1],
      [2, 2, 2, 2],
      [3, 3, 3, 3],
    ]);
  });

  it("stops with the error a task throws, its name and message kept", async () => {
    const script = workerScript(
      'if (task === 37) { const e = new Error("task 37 is out of budget"); e.name = "BudgetError"; throw e; } return { reply: task };',
    );
    const error = await failureOf(script, 100);
    expect(error.name).toBe("BudgetError");
    expect(error.message).toBe("task 37 is out of budget");
  });

  it("fails the run, naming what happened, when a worker dies on a task", async () => {
    const script = workerScript("if (task === 5) process.exit(3); return { reply: task };");
    expect((await failureOf(script, 20)).message).toBe("worker exited with code 3");
  }, 60_000);
});

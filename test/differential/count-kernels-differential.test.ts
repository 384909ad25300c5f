/**
 * Randomised differential test of the two plain-counting kernels, each case under a hard time bound: the
 * WebAssembly kernel (64-bit words) and the TypeScript reference (32-bit words) must give identical counts,
 * truncation flags and Euler characteristics, and stop on the same budgets — over thousands of seeded graphs
 * (test/support/kernel-cases.ts): the small shapes of the differential cases and wide graphs whose local
 * universes span several words. The counts themselves are checked against outside references elsewhere
 * (test/reference/counting-*.test.ts) and against the sweep and the homology in homology-differential.
 * CLIQUESCAPE_DIFFERENTIAL_SEED varies the seeds (the default keeps runs reproducible).
 */
import { beforeAll, describe, expect, it } from "vitest";
import { BUILT_CORE_URL, buildCore } from "../support/built-core.js";
import { describeKernelCase, kernelCases } from "../support/kernel-cases.js";
import { runTimeBounded } from "../support/time-bounded-worker.js";

const BASE_SEED = Number(process.env.CLIQUESCAPE_DIFFERENTIAL_SEED ?? 20261202);
const WORKER = new URL("../support/count-kernels-worker.mjs", import.meta.url);
const CASE_LIMIT_MS = 15_000;

type Outcome =
  | { counts: number[]; truncated: boolean; euler: number }
  | { stopped: true; counted: number[]; progress: number };
type Pair = { webassembly: Outcome; typescript: Outcome };
type Runs = { plain: Pair; atTotal?: Pair; belowTotal?: Pair };

const total = (xs: number[]) => xs.reduce((a, b) => a + b, 0);

function problemsOf(runs: Runs, budget: number): string[] {
  const problems: string[] = [];
  const { webassembly: w, typescript: t } = runs.plain;
  if ("stopped" in w || "stopped" in t) {
    if (!("stopped" in w && "stopped" in t))
      problems.push(`only one kernel stopped: ${JSON.stringify(runs.plain)}`);
    for (const [name, o] of Object.entries(runs.plain))
      if ("stopped" in o && !(total(o.counted) > budget && o.progress >= 0 && o.progress <= 1))
        problems.push(`${name} stopped with ${total(o.counted)} simplices, progress ${o.progress}`);
  } else if (JSON.stringify(w) !== JSON.stringify(t)) {
    problems.push(`webassembly ${JSON.stringify(w)} ≠ typescript ${JSON.stringify(t)}`);
  }
  if (runs.atTotal && "counts" in t) {
    const exact = total(t.counts);
    for (const [name, o] of Object.entries(runs.atTotal))
      if (JSON.stringify(o) !== JSON.stringify(t))
        problems.push(`${name} with budget = total: ${JSON.stringify(o)}`);
    // the budget is passed by the last simplex counted, and checked before anything else is added
    for (const [name, o] of Object.entries(runs.belowTotal ?? {}))
      if (!("stopped" in o) || total(o.counted) !== exact)
        problems.push(`${name} with budget = total − 1: ${JSON.stringify(o)}`);
  }
  return problems;
}

beforeAll(() => buildCore(), 120_000);

describe("differential: WebAssembly and TypeScript counting kernels agree, each case time-bounded", () => {
  it("3,000 small and 800 wide graphs, undirected and directed", async () => {
    const cases = kernelCases(3000, 800, BASE_SEED);
    const outcomes = await runTimeBounded<(typeof cases)[number], Runs>(
      WORKER,
      { coreUrl: BUILT_CORE_URL },
      cases,
      CASE_LIMIT_MS,
    );
    const failures: string[] = [];
    const seen = { complete: 0, truncated: 0, stopped: 0, budgetEdges: 0, top: 0 };
    for (const outcome of outcomes) {
      const c = cases[outcome.index];
      if (outcome.status === "timeout")
        failures.push(`${describeKernelCase(c)}: no answer in ${CASE_LIMIT_MS} ms`);
      else if (outcome.status === "error") failures.push(`${describeKernelCase(c)}: ${outcome.message}`);
      else {
        for (const p of problemsOf(outcome.result, c.budget)) failures.push(`${describeKernelCase(c)}: ${p}`);
        const t = outcome.result.plain.typescript;
        if ("stopped" in t) seen.stopped++;
        else {
          if (t.truncated) seen.truncated++;
          else seen.complete++;
          seen.top = Math.max(seen.top, t.counts.length - 1);
        }
        if (outcome.result.belowTotal) seen.budgetEdges++;
      }
    }
    console.log(`kernel differential: ${JSON.stringify(seen)}`);
    expect(failures.slice(0, 20)).toEqual([]);
    expect(outcomes).toHaveLength(3800);
    // The cases reach every outcome: complete counts, capped ones, budget stops, high dimensions.
    expect(seen.complete).toBeGreaterThanOrEqual(1000);
    expect(seen.truncated).toBeGreaterThanOrEqual(300);
    expect(seen.stopped).toBeGreaterThanOrEqual(20);
    expect(seen.budgetEdges).toBeGreaterThanOrEqual(300);
    expect(seen.top).toBeGreaterThanOrEqual(15);
  }, 900_000);
});

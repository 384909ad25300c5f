/**
 * Runs differential cases on the time-bounded worker (test/support/differential-worker.mjs, the built core)
 * and checks that the computations agree: both clique layouts (or the directed tables) give the same
 * barcode, Betti numbers read off it equal the independent rank path (bettiAt), the sweep (per-threshold
 * WebAssembly counts) equals the one-pass annotated TypeScript sweep and separate counts at each threshold, and χ = Σ(−1)^k c_k = Σ(−1)^k β_k where every dimension is covered (Euler–Poincaré;
 * common practice, e.g. A. Hatcher, Algebraic Topology, 2002, Theorem 2.44).
 */
import { sweepPolicies } from "./band-sweep-policies.js";
import { BUILT_CORE_URL } from "./built-core.js";
import { type DifferentialCase, describeCase } from "./differential-cases.js";
import { runTimeBounded } from "./time-bounded-worker.js";

const WORKER = new URL("./differential-worker.mjs", import.meta.url);
/** Per case; a case normally takes milliseconds, so only a hang (or something as bad) reaches it. */
export const CASE_LIMIT_MS = 15_000;

export interface CaseResult {
  maxDim: number;
  barcodes: Record<string, { bars: unknown[]; betti: number[][] }>;
  counts: { counts: number[]; euler: number; truncated: boolean }[];
  swept: {
    threshold: number;
    counts: number[];
    reference: number[];
    euler: [number, number];
    truncated: [boolean, boolean];
  }[];
  ranks: number[][] | null;
}

function checkCase(c: DifferentialCase, r: CaseResult, layouts: string[]): string[] {
  const problems: string[] = [];
  const first = r.barcodes[layouts[0]];
  for (const layout of layouts.slice(1)) {
    if (JSON.stringify(r.barcodes[layout].bars) !== JSON.stringify(first.bars))
      problems.push(`${layout} barcode differs from ${layouts[0]}`);
  }
  c.thresholds.forEach((threshold, t) => {
    const betti = first.betti[t];
    if (r.ranks && JSON.stringify(r.ranks[t]) !== JSON.stringify(betti))
      problems.push(`at ${threshold}: barcode Betti ${betti} ≠ rank Betti ${r.ranks[t]}`);
    const { counts, euler, truncated } = r.counts[t];
    // The sweep lists every threshold up to the top dimension of the last: drop its trailing zeros.
    const swept = r.swept.find((s) => s.threshold === threshold);
    if (
      swept &&
      (JSON.stringify(swept.counts) !== JSON.stringify(swept.reference) ||
        swept.euler[0] !== swept.euler[1] ||
        swept.truncated[0] !== swept.truncated[1])
    )
      problems.push(
        `at ${threshold}: sweep ${swept.counts} (χ ${swept.euler[0]}, truncated ${swept.truncated[0]}) ≠ ` +
          `TypeScript sweep ${swept.reference} (χ ${swept.euler[1]}, truncated ${swept.truncated[1]})`,
      );
    if (swept) while (swept.counts.length > counts.length && swept.counts.at(-1) === 0) swept.counts.pop();
    if (!swept || JSON.stringify(swept.counts) !== JSON.stringify(counts))
      problems.push(`at ${threshold}: sweep counts ${swept?.counts} ≠ counts ${counts}`);
    const alternating = counts.reduce((sum, x, k) => sum + (k % 2 === 0 ? x : -x), 0);
    if (alternating !== euler) problems.push(`at ${threshold}: χ ${euler} ≠ Σ(−1)^k c_k ${alternating}`);
    // With no simplex above maxDim every Betti number is known: Euler–Poincaré.
    if (!truncated && counts.length - 1 <= r.maxDim) {
      const fromBetti = betti.reduce((sum, x, k) => sum + (k % 2 === 0 ? x : -x), 0);
      if (fromBetti !== euler) problems.push(`at ${threshold}: χ ${euler} ≠ Σ(−1)^k β_k ${fromBetti}`);
    }
  });
  return problems;
}

/** `simplexLimit`: the worker lowers maxDim until the complex has at most this many simplices. */
export async function runDifferentialCases(
  cases: DifferentialCase[],
  layouts: string[],
  simplexLimit = 4000,
) {
  const tasks = cases.map((c) => ({
    index: c.index,
    graph: c.graph,
    semantics: c.semantics,
    prime: c.prime,
    maxDim: c.maxDim,
    thresholds: c.thresholds,
    layouts,
    sweepPolicies,
    rank: true,
    simplexLimit,
  }));
  const outcomes = await runTimeBounded<(typeof tasks)[number], CaseResult>(
    WORKER,
    { coreUrl: BUILT_CORE_URL },
    tasks,
    CASE_LIMIT_MS,
  );
  const failures: string[] = [];
  let ranked = 0;
  let dims = 0;
  // How varied the cases were: used dimensions, and cases with a class in dimension k somewhere.
  const usedDim = new Array<number>(6).fill(0);
  const withClass = new Array<number>(6).fill(0);
  for (const outcome of outcomes) {
    const c = cases[outcome.index];
    if (outcome.status === "timeout") failures.push(`${describeCase(c)}: no answer in ${CASE_LIMIT_MS} ms`);
    else if (outcome.status === "error") failures.push(`${describeCase(c)}: ${outcome.message}`);
    else {
      for (const p of checkCase(c, outcome.result, layouts)) failures.push(`${describeCase(c)}: ${p}`);
      if (outcome.result.ranks) ranked++;
      dims = Math.max(dims, outcome.result.maxDim);
      usedDim[outcome.result.maxDim]++;
      const betti = Object.values(outcome.result.barcodes)[0].betti;
      for (let k = 0; k <= outcome.result.maxDim; k++) if (betti.some((b) => b[k] > 0)) withClass[k]++;
    }
  }
  return { outcomes, failures, ranked, dims, usedDim, withClass };
}

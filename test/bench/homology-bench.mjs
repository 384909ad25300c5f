// Homology benchmark: persistence barcodes of seeded graphs, each case in its own child process so its
// time and peak memory are its own. Needs `npm run build` first (`npm run bench:homology` does both).
//
//   node test/bench/homology-bench.mjs [--only corr100,uniform200,...] [--timeout SECONDS] [--budget GIB]
//                                      [--markdown FILE]
//   node test/bench/homology-bench.mjs --child CASE BUDGET_BYTES      (one measurement, one JSON line)
//
// Cases: complete similarity matrices (Pearson correlations of n seeded Gaussian series of 50 samples, and
// independent uniform weights) n = 100, 200, 400 (uniform also 140, 160), H0–H2 of the full filtration; sparse undirected
// Erdős–Rényi n = 5000, mean degree 20, H0–H1; directed Erdős–Rényi n = 300, p = 0.1, H0–H2.
// A case that exceeds the time limit is reported as "timeout"; one that exceeds the memory budget reports
// the HomologyBudgetError message.
import { spawnSync } from "node:child_process";
import { appendFileSync } from "node:fs";
import { cpus, totalmem } from "node:os";
import { fileURLToPath } from "node:url";
import { computeBarcode, fromEdgeList } from "../../packages/core/dist/index.js";
import { seededRandom } from "./random.mjs";

const CASES = {
  corr100: { kind: "correlation", n: 100, maxDim: 2 },
  uniform100: { kind: "uniform", n: 100, maxDim: 2 },
  corr200: { kind: "correlation", n: 200, maxDim: 2 },
  uniform140: { kind: "uniform", n: 140, maxDim: 2 },
  uniform160: { kind: "uniform", n: 160, maxDim: 2 },
  uniform200: { kind: "uniform", n: 200, maxDim: 2 },
  corr400: { kind: "correlation", n: 400, maxDim: 2 },
  corr300: { kind: "correlation", n: 300, maxDim: 2 },
  uniform400: { kind: "uniform", n: 400, maxDim: 2 },
  sparse5000: { kind: "sparse", n: 5000, degree: 20, maxDim: 1 },
  directed300: { kind: "directed", n: 300, p: 0.1, maxDim: 2 },
};

function describe(name) {
  const c = CASES[name];
  if (c.kind === "correlation") return `complete, correlation (50 samples), n = ${c.n}, H0–H2`;
  if (c.kind === "uniform") return `complete, uniform weights, n = ${c.n}, H0–H2`;
  if (c.kind === "sparse") return `sparse undirected, n = ${c.n}, mean degree ${c.degree}, H0–H1`;
  return `directed Erdős–Rényi, n = ${c.n}, p = ${c.p}, H0–H2`;
}

/** Standard normal by Box–Muller from the seeded uniform generator. */
function gaussian(rnd) {
  return Math.sqrt(-2 * Math.log(rnd())) * Math.cos(2 * Math.PI * rnd());
}

function buildGraph(c) {
  const rnd = seededRandom(20261202 + c.n);
  const sources = [];
  const targets = [];
  const weights = [];
  if (c.kind === "correlation") {
    const samples = 50;
    const x = new Float64Array(c.n * samples);
    for (let i = 0; i < c.n; i++) {
      let mean = 0;
      for (let t = 0; t < samples; t++) mean += x[i * samples + t] = gaussian(rnd);
      mean /= samples;
      let norm = 0;
      for (let t = 0; t < samples; t++) {
        x[i * samples + t] -= mean;
        norm += x[i * samples + t] ** 2;
      }
      norm = Math.sqrt(norm);
      for (let t = 0; t < samples; t++) x[i * samples + t] /= norm;
    }
    for (let i = 0; i < c.n; i++) {
      for (let j = i + 1; j < c.n; j++) {
        let r = 0;
        for (let t = 0; t < samples; t++) r += x[i * samples + t] * x[j * samples + t];
        sources.push(i);
        targets.push(j);
        weights.push(r);
      }
    }
    return {
      graph: fromEdgeList({ n: c.n, sources, targets, weights, directed: false, negative: "keep" }),
      semantics: "similarity",
    };
  }
  if (c.kind === "uniform") {
    for (let i = 0; i < c.n; i++) {
      for (let j = i + 1; j < c.n; j++) {
        sources.push(i);
        targets.push(j);
        weights.push(rnd());
      }
    }
    return {
      graph: fromEdgeList({ n: c.n, sources, targets, weights, directed: false }),
      semantics: "similarity",
    };
  }
  if (c.kind === "sparse") {
    const p = c.degree / (c.n - 1);
    for (let i = 0; i < c.n; i++) {
      for (let j = i + 1; j < c.n; j++) {
        if (rnd() < p) {
          sources.push(i);
          targets.push(j);
          weights.push(rnd());
        }
      }
    }
    return {
      graph: fromEdgeList({ n: c.n, sources, targets, weights, directed: false }),
      semantics: "distance",
    };
  }
  for (let i = 0; i < c.n; i++) {
    for (let j = 0; j < c.n; j++) {
      if (i !== j && rnd() < c.p) {
        sources.push(i);
        targets.push(j);
        weights.push(rnd());
      }
    }
  }
  return {
    graph: fromEdgeList({ n: c.n, sources, targets, weights, directed: true }),
    semantics: "distance",
  };
}

function child(name, budgetBytes) {
  const c = CASES[name];
  const { graph, semantics } = buildGraph(c);
  const cpu0 = process.cpuUsage();
  const t0 = performance.now();
  const out = { case: name, n: c.n, edges: graph.targets.length / (graph.directed ? 1 : 2) };
  try {
    const b = computeBarcode(graph, { semantics, maxDim: c.maxDim, budget: { maxBytes: budgetBytes } });
    const bars = new Array(c.maxDim + 1).fill(0);
    for (const bar of b.bars) bars[bar.dim]++;
    Object.assign(out, { status: "ok", bars, stats: b.stats });
  } catch (e) {
    if (e?.name !== "HomologyBudgetError") throw e;
    Object.assign(out, { status: "budget", error: e.message });
  }
  const cpu = process.cpuUsage(cpu0);
  out.wallSeconds = (performance.now() - t0) / 1000;
  out.cpuSeconds = (cpu.user + cpu.system) / 1e6;
  out.peakRssMiB = process.resourceUsage().maxRSS / 1024;
  console.log(JSON.stringify(out));
}

function fmt(x, digits = 2) {
  return x === undefined ? "—" : x.toFixed(digits);
}

function main(args) {
  const option = (flag, fallback) => {
    const i = args.indexOf(flag);
    return i >= 0 && i + 1 < args.length ? args[i + 1] : fallback;
  };
  const only = option("--only", undefined);
  const names = only ? only.split(",") : Object.keys(CASES);
  for (const name of names) if (!CASES[name]) throw new Error(`unknown case ${name}`);
  const timeout = Number(option("--timeout", "600"));
  const budgetBytes = Math.round(Number(option("--budget", "3.5")) * 1024 ** 3);
  const markdown = option("--markdown", undefined);
  const self = fileURLToPath(import.meta.url);
  console.log(
    `# homology bench ${new Date().toISOString()} node ${process.version}, ${cpus().length} CPUs, ` +
      `${(totalmem() / 1024 ** 3).toFixed(0)} GiB, budget ${(budgetBytes / 1024 ** 3).toFixed(2)} GiB, timeout ${timeout} s`,
  );
  const header =
    "| case | status | wall s | CPU s | peak RSS MiB | bars H0/H1/H2 | apparent | emergent | cleared | reduced | swept | additions |\n" +
    "|---|---|---|---|---|---|---|---|---|---|---|---|";
  console.log(header);
  if (markdown) appendFileSync(markdown, `${header}\n`);
  for (const name of names) {
    const r = spawnSync(
      process.execPath,
      ["--max-old-space-size=4096", self, "--child", name, String(budgetBytes)],
      {
        encoding: "utf8",
        timeout: timeout * 1000,
        maxBuffer: 1 << 24,
      },
    );
    let row;
    if (r.error?.code === "ETIMEDOUT" || r.signal === "SIGTERM") {
      row = `| ${describe(name)} | timeout after ${timeout} s | — | — | — | — | — | — | — | — | — | — |`;
    } else if (r.status !== 0) {
      row = `| ${describe(name)} | crashed: ${(r.stderr || "").trim().split("\n").pop()} | — | — | — | — | — | — | — | — | — | — |`;
    } else {
      const o = JSON.parse(r.stdout.trim().split("\n").pop());
      if (o.status === "budget") {
        row = `| ${describe(name)} | budget: ${o.error} | ${fmt(o.wallSeconds)} | ${fmt(o.cpuSeconds)} | ${fmt(o.peakRssMiB, 0)} | — | — | — | — | — | — | — |`;
      } else {
        const s = o.stats;
        const list = (a) => a.join("/");
        row = `| ${describe(name)} | ok | ${fmt(o.wallSeconds)} | ${fmt(o.cpuSeconds)} | ${fmt(o.peakRssMiB, 0)} | ${list(o.bars)} | ${list(s.apparentPairs)} | ${list(s.emergentPairs)} | ${list(s.clearedColumns)} | ${list(s.columnsReduced)} | ${list(s.sweptColumns)} | ${list(s.columnAdditions)} |`;
      }
    }
    console.log(row);
    if (markdown) appendFileSync(markdown, `${row}\n`);
  }
}

const argv = process.argv.slice(2);
if (argv[0] === "--child") child(argv[1], Number(argv[2]));
else main(argv);

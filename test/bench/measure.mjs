// One benchmark measurement in its own process, so its peak memory (maxRSS) is its own.
//   node measure.mjs generate NAME DIR        write DIR/NAME.txt (+ NAME.weights.json sidecar)
//   node measure.mjs count FILE REPEAT [KERNEL] time countSimplices on all edges (kernel: auto, webassembly, typescript)
//   node measure.mjs sweep FILE THRESHOLDS     time sweepSimplexCounts on an even grid vs a plain count
//   node measure.mjs yardstick BIN FILE REPEAT run the yardstick binary; its time_s and its CPU time
// Prints one JSON line on stdout.
import { spawnSync } from "node:child_process";
import { existsSync, readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import {
  countSimplices,
  evenGrid,
  explicitGrid,
  fromEdgeList,
  sweepSimplexCounts,
} from "../../packages/core/dist/index.js";
import { readEdgeListFile, writeEdgeListFile } from "./edge-list-file.mjs";
import { generateGraph } from "./models.mjs";
import { seededRandom } from "./random.mjs";

const [mode, a, b] = process.argv.slice(2);

function seconds(t0) {
  return (performance.now() - t0) / 1000;
}

function median(xs) {
  const s = [...xs].sort((x, y) => x - y);
  return s[Math.floor(s.length / 2)];
}

/** Reads a graph file; weights from our sidecar when we generated it, else seeded uniform(0,1) distances. */
function loadGraph(file) {
  const e = readEdgeListFile(file);
  const side = file.replace(/\.txt$/, ".weights.bin");
  let weights;
  let semantics = "distance";
  if (existsSync(side)) {
    const buf = readFileSync(side);
    weights = new Float64Array(buf.buffer, buf.byteOffset, buf.length / 8);
    semantics = JSON.parse(readFileSync(file.replace(/\.txt$/, ".json"), "utf8")).semantics;
  } else {
    const rnd = seededRandom(e.sources.length);
    weights = new Float64Array(e.sources.length);
    for (let i = 0; i < weights.length; i++) weights[i] = rnd();
  }
  const t0 = performance.now();
  const graph = fromEdgeList({ ...e, weights });
  return { graph, semantics, weights, csrSeconds: seconds(t0) };
}

/** CPU seconds of this process (user + system). */
function cpuSeconds() {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1e6;
}

/** CPU seconds of waited-for children (Linux /proc/self/stat cutime + cstime), or NaN elsewhere. */
function childCpuSeconds() {
  try {
    const fields = readFileSync("/proc/self/stat", "utf8").split(") ")[1].split(" ");
    // after "pid (comm) ": field 3 is state, so cutime (16) and cstime (17) sit at 13 and 14
    return (Number(fields[13]) + Number(fields[14])) / 100;
  } catch {
    return Number.NaN;
  }
}

function peakMiB() {
  return process.resourceUsage().maxRSS / 1024;
}

if (mode === "generate") {
  const g = generateGraph(a);
  const file = join(b, `${a}.txt`);
  writeEdgeListFile(file, g);
  writeFileSync(
    file.replace(/\.txt$/, ".weights.bin"),
    Buffer.from(g.weights.buffer, 0, g.weights.byteLength),
  );
  writeFileSync(file.replace(/\.txt$/, ".json"), JSON.stringify({ semantics: g.semantics, note: g.note }));
  console.log(JSON.stringify({ file, n: g.n, edges: g.sources.length, note: g.note }));
} else if (mode === "count") {
  const kernel = process.argv[5] ?? "auto";
  const { graph, csrSeconds } = loadGraph(a);
  const times = [];
  const cpu = [];
  let r;
  for (let i = 0; i < Number(b ?? 1); i++) {
    const t0 = performance.now();
    const c0 = cpuSeconds();
    r = countSimplices(graph, { kernel });
    times.push(seconds(t0));
    cpu.push(cpuSeconds() - c0);
  }
  console.log(
    JSON.stringify({
      n: graph.n,
      edges: graph.directed ? graph.targets.length : graph.targets.length / 2,
      counts: Array.from(r.counts),
      seconds: median(times),
      cpuSeconds: median(cpu),
      csrSeconds,
      peakMiB: peakMiB(),
    }),
  );
} else if (mode === "sweep") {
  const { graph, semantics, weights } = loadGraph(a);
  let lo = Infinity;
  let hi = -Infinity;
  for (const w of weights) {
    if (w < lo) lo = w;
    if (w > hi) hi = w;
  }
  const T = Number(b ?? 50);
  const grid = semantics === "distance" ? evenGrid(lo, hi, T, semantics) : evenGrid(hi, lo, T, semantics);
  // CPU seconds: the machine may be shared, and all three runs are single-threaded
  let c0 = cpuSeconds();
  const sweep = sweepSimplexCounts(graph, grid);
  const sweepSeconds = cpuSeconds() - c0;
  c0 = cpuSeconds();
  const one = sweepSimplexCounts(graph, explicitGrid([semantics === "distance" ? hi : lo], semantics));
  const oneSeconds = cpuSeconds() - c0;
  c0 = cpuSeconds();
  const plain = countSimplices(graph);
  const countSeconds = cpuSeconds() - c0;
  const last = Array.from(sweep.counts[sweep.counts.length - 1]);
  while (last.length > plain.counts.length && last[last.length - 1] === 0) last.pop();
  console.log(
    JSON.stringify({
      thresholds: T,
      sweepSeconds,
      oneSeconds,
      countSeconds,
      agrees:
        JSON.stringify(last) === JSON.stringify(Array.from(plain.counts)) &&
        JSON.stringify(Array.from(one.counts[0]).slice(0, plain.counts.length)) ===
          JSON.stringify(Array.from(plain.counts)),
      peakMiB: peakMiB(),
    }),
  );
} else if (mode === "yardstick") {
  const [, bin, file, repeat] = process.argv.slice(2);
  const times = [];
  const cpu = [];
  let counts = [];
  for (let i = 0; i < Number(repeat ?? 1); i++) {
    const c0 = childCpuSeconds();
    const run = spawnSync(bin, [file], { encoding: "utf8", maxBuffer: 1 << 24 });
    if (run.status !== 0) throw new Error(`${bin} failed: ${run.stderr}`);
    const out = run.stdout;
    counts = [...out.matchAll(/^dim (\d+) (\d+)$/gm)].map((m) => Number(m[2]));
    times.push(Number(/^time_s (\S+)$/m.exec(out)[1]));
    // its CPU time less its file parsing, which its time_s leaves out too (10 ms clock ticks)
    cpu.push(childCpuSeconds() - c0 - Number(/^parse_s (\S+)$/m.exec(out)[1]));
  }
  console.log(JSON.stringify({ seconds: median(times), cpuSeconds: median(cpu), counts }));
} else {
  console.error(
    "usage: measure.mjs generate NAME DIR | count FILE [REPEAT [KERNEL]] | sweep FILE [THRESHOLDS] | yardstick BIN FILE [REPEAT]",
  );
  process.exit(2);
}

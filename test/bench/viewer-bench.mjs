// Speed of the viewer in headless Chromium (Debian's /usr/bin/chromium through playwright-core).
//   node test/bench/viewer-bench.mjs [--only graph|report] [--repeat 20]      (after npm run build)
// 1. A 2,000-node, 40,000-edge graph served by `cliquescape view`: slider moves to redrawn graph and numbers
//    (jumps to random steps, and a drag: consecutive moves of 1 % of the range), choosing a loop (threshold
//    to its birth, loop drawn) and drawing a loop alone (its threshold already set), each timed in the page from the input to the second animation
//    frame after it (the frame that shows the change), median of 20. CPU: user + system time of every
//    Chromium process of the run (/proc/PID/stat), per move — on a shared machine wall time also counts
//    the time other processes hold the cores.
// 2. The report of a 1,000-graph run opened from disk: from navigation start to the run page drawn
//    (table, curves, map), median of 5 fresh loads.
// Prints a JSON summary on stdout; progress on stderr. Inputs are generated (seeded) into .bench/viewer/.
import { spawn, spawnSync } from "node:child_process";
import {
  existsSync,
  mkdirSync,
  mkdtempSync,
  readdirSync,
  readFileSync,
  rmSync,
  writeFileSync,
} from "node:fs";
import { loadavg, tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { chromium } from "playwright-core";
import { CHROMIUM, CHROMIUM_ARGS } from "../browser/chromium-flags.mjs";
import { seededRandom } from "./random.mjs";

const root = fileURLToPath(new URL("../../", import.meta.url));
const bin = join(root, "packages/cli/bin/cliquescape.js");
const base = join(root, ".bench", "viewer");
const option = (name, fallback) => {
  const i = process.argv.indexOf(name);
  return i >= 0 ? process.argv[i + 1] : fallback;
};
const repeat = Number(option("--repeat", "20"));
const only = option("--only", "all");
const log = (text) => process.stderr.write(`${text}\n`);
const median = (xs) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const round = (x) => Math.round(x * 10) / 10;

/** A seeded random graph: n nodes, exactly m distinct edges with uniform(0, 1) similarity weights. */
function randomEdgeList(n, m, seed) {
  const random = seededRandom(seed);
  const seen = new Set();
  const lines = ["source,target,weight"];
  while (seen.size < m) {
    const u = Math.floor(random() * n);
    const v = Math.floor(random() * n);
    if (u === v) continue;
    const key = u < v ? u * n + v : v * n + u;
    if (seen.has(key)) continue;
    seen.add(key);
    lines.push(`v${u},v${v},${random().toFixed(6)}`);
  }
  return `${lines.join("\n")}\n`;
}

/** Sites in the unit square joined when closer than r; weight exp(−d²/2r²): 3 labels with different r. */
function geometricEdgeList(n, r, seed) {
  const random = seededRandom(seed);
  const xy = Array.from({ length: n }, () => [random(), random()]);
  const lines = ["source,target,weight"];
  for (let u = 0; u < n; u++)
    for (let v = u + 1; v < n; v++) {
      const d = Math.hypot(xy[u][0] - xy[v][0], xy[u][1] - xy[v][1]);
      if (d < r) lines.push(`s${u},s${v},${Math.exp(-(d * d) / (2 * r * r)).toFixed(4)}`);
    }
  return `${lines.join("\n")}\n`;
}

function launch() {
  const profile = mkdtempSync(join(tmpdir(), "cliquescape-bench-chromium-"));
  return chromium
    .launchPersistentContext(profile, {
      executablePath: CHROMIUM,
      headless: true,
      viewport: { width: 1280, height: 800 },
      args: CHROMIUM_ARGS,
    })
    .then((context) => ({
      context,
      cpu: () => chromiumCpuSeconds(profile),
      close: async () => {
        await context.close();
        rmSync(profile, { recursive: true, force: true });
      },
    }));
}

function startView(file) {
  const child = spawn(process.execPath, [bin, "view", file], { stdio: ["ignore", "pipe", "inherit"] });
  return new Promise((resolve, reject) => {
    let out = "";
    child.once("exit", (code) => reject(new Error(`view exited ${code}`)));
    child.stdout.on("data", (chunk) => {
      out += chunk;
      const match = /at (http:\/\/\S+\/)/.exec(out);
      if (match) resolve({ url: match[1], stop: () => child.kill("SIGINT") });
    });
  });
}

/** CPU seconds (user + system) used so far by every process whose command line names the profile folder. */
function chromiumCpuSeconds(profile) {
  const tick = 100; // USER_HZ: clock ticks per second on Linux (getconf CLK_TCK)
  let total = 0;
  for (const pid of readdirSync("/proc")) {
    if (!/^\d+$/.test(pid)) continue;
    try {
      if (!readFileSync(`/proc/${pid}/cmdline`, "utf8").includes(profile)) continue;
      const fields = readFileSync(`/proc/${pid}/stat`, "utf8").split(") ")[1].split(" ");
      total += (Number(fields[11]) + Number(fields[12])) / tick;
    } catch {
      // The process ended meanwhile.
    }
  }
  return total;
}

async function benchGraph() {
  mkdirSync(base, { recursive: true });
  const file = join(base, "er-2000-40000.csv");
  if (!existsSync(file)) writeFileSync(file, randomEdgeList(2000, 40000, 2026));
  const view = await startView(file);
  const { context, close, cpu } = await launch();
  const page = context.pages()[0] ?? (await context.newPage());
  const t0 = Date.now();
  await page.goto(view.url);
  await page.waitForFunction(() => window.cliquescape?.graph !== undefined, null, { timeout: 600_000 });
  const openSeconds = (Date.now() - t0) / 1000;
  log(`graph open (analysis, layout, charts): ${openSeconds.toFixed(1)} s`);
  const steps = await page.evaluate(() => window.cliquescape.graph.analysis.thresholds.length);
  const random = seededRandom(7);
  const jumps = Array.from({ length: repeat }, () => Math.floor(random() * steps));
  const stride = Math.max(1, Math.round(steps / 100));
  const drag = Array.from({ length: repeat }, (_, i) => Math.round(steps * 0.3) + i * stride);
  const moves = (positions) =>
    page.evaluate(async (positions) => {
      const frame = () => new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(r)));
      const input = document.querySelector("#threshold-slider");
      const times = [];
      for (const p of positions) {
        await frame();
        const t = performance.now();
        input.value = String(p);
        input.dispatchEvent(new Event("input"));
        await frame();
        times.push(performance.now() - t);
      }
      return times;
    }, positions);
  const cpu0 = cpu();
  const jumped = await moves(jumps);
  const cpu1 = cpu();
  const dragged = await moves(drag);
  const cpu2 = cpu();
  const loops = await page.evaluate(async (repeat) => {
    const frame = () => new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(r)));
    const g = window.cliquescape.graph;
    const times = [];
    for (let i = 0; i < repeat; i++) {
      await frame();
      const t = performance.now();
      await g.chooseBar(g.loopBars[i % g.loopBars.length]);
      await frame();
      times.push(performance.now() - t);
    }
    return { times, bars: g.loopBars.length };
  }, repeat);
  const cpu3 = cpu();
  // The loop drawing alone, its threshold already set: the loop layer and the veil.
  const drawn = await page.evaluate(async (repeat) => {
    const frame = () => new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(r)));
    const g = window.cliquescape.graph;
    const times = [];
    for (let i = 0; i < repeat; i++) {
      const pairs = await g.loopOf(g.loopBars[i % g.loopBars.length]);
      await frame();
      const t = performance.now();
      g.canvas.showLoop(pairs);
      await frame();
      times.push(performance.now() - t);
    }
    return times;
  }, repeat);
  const cpu4 = cpu();
  // Panning with every edge shown: from cytoscape's pan to the second frame after it, a move every two
  // frames (a drag), so the edges are never stroked again in between.
  const panned = await page.evaluate(async (repeat) => {
    const frame = () => new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(r)));
    const input = document.querySelector("#threshold-slider");
    input.value = input.max;
    input.dispatchEvent(new Event("input"));
    await frame();
    const g = window.cliquescape.graph;
    const times = [];
    for (let i = 0; i < repeat; i++) {
      await frame();
      const t = performance.now();
      g.canvas.cy.panBy({ x: 3, y: 2 });
      await frame();
      times.push(performance.now() - t);
    }
    return { times, shown: g.canvas.shownEdgeCount() };
  }, repeat);
  const cpu5 = cpu();
  await close();
  view.stop();
  const summary = (times, seconds) => ({
    medianMs: round(median(times)),
    maxMs: round(Math.max(...times)),
    cpuMsEach: round((seconds * 1000) / times.length),
  });
  return {
    graph: { nodes: 2000, edges: 40000, steps, openSeconds: round(openSeconds) },
    sliderJump: summary(jumped, cpu1 - cpu0),
    sliderDrag: { stepsPerMove: stride, ...summary(dragged, cpu2 - cpu1) },
    loopChoice: { listed: loops.bars, ...summary(loops.times, cpu3 - cpu2) },
    loopDrawing: summary(drawn, cpu4 - cpu3),
    pan: { shownEdges: panned.shown, ...summary(panned.times, cpu5 - cpu4) },
  };
}

async function benchReport() {
  const dataset = join(base, "run-1000");
  const run = join(base, "run-1000-out");
  const report = join(base, "report-1000.html");
  if (!existsSync(join(run, "features.csv"))) {
    mkdirSync(dataset, { recursive: true });
    const labels = [
      ["dense", 0.3],
      ["medium", 0.24],
      ["sparse", 0.18],
    ];
    const manifest = ["id,file,label"];
    for (let g = 0; g < 1000; g++) {
      const [label, r] = labels[g % 3];
      const id = `g${String(g).padStart(4, "0")}`;
      writeFileSync(join(dataset, `${id}.csv`), geometricEdgeList(40, r, 5000 + g));
      manifest.push(`${id},${id}.csv,${label}`);
    }
    writeFileSync(join(dataset, "manifest.csv"), `${manifest.join("\n")}\n`);
    log("extracting the 1,000-graph run (once; kept in .bench/viewer)…");
    const t = Date.now();
    const extract = spawnSync(
      process.execPath,
      [bin, "extract", join(dataset, "manifest.csv"), "--out", run, "--workers", "2"],
      { stdio: ["ignore", "ignore", "inherit"] },
    );
    if (extract.status !== 0) throw new Error(`extract failed (${extract.status})`);
    log(`  ${((Date.now() - t) / 1000).toFixed(0)} s`);
  }
  const written = spawnSync(process.execPath, [bin, "report", run, "--out", report], { encoding: "utf8" });
  if (written.status !== 0) throw new Error(written.stderr);
  const { context, close, cpu } = await launch();
  const loads = [];
  const cpu0 = cpu();
  for (let i = 0; i < 5; i++) {
    const page = await context.newPage();
    await page.goto(pathToFileURL(report).href);
    const ms = await page.evaluate(() =>
      window.cliquescape.ready.then(
        () =>
          new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(() => r(performance.now())))),
      ),
    );
    if ((await page.locator("table.run-table tbody tr").count()) !== 1000)
      throw new Error("the table does not hold 1,000 rows");
    loads.push(ms);
    await page.close();
  }
  const cpuMsEach = ((cpu() - cpu0) * 1000) / loads.length;
  await close();
  const { size } = await import("node:fs").then((fs) => fs.statSync(report));
  return {
    reportMiB: round(size / 2 ** 20),
    openMs: {
      median: Math.round(median(loads)),
      all: loads.map(Math.round),
      cpuMsEach: Math.round(cpuMsEach),
    },
  };
}

const started = new Date().toISOString();
const loadBefore = loadavg().map(round);
const graph = only === "report" ? null : await benchGraph();
const report = only === "graph" ? null : await benchReport();
console.log(
  JSON.stringify(
    {
      started,
      loadAverage: { before: loadBefore, after: loadavg().map(round) },
      cores: (await import("node:os")).cpus().length,
      ...graph,
      report,
    },
    null,
    2,
  ),
);

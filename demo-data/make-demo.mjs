#!/usr/bin/env node
// Writes the invented "three culture chambers" demo dataset of cliquescape (see demo-data/README.md).
//
// Deterministic: one seeded generator (splitmix32 below), no dependencies, no clock, no Math.random, and
// every weight rounded to 3 decimals before it is written, so the same Node version writes the same bytes on
// every run. Usage:
//   node demo-data/make-demo.mjs            (writes next to this script)
//   node demo-data/make-demo.mjs OUT_DIR    (writes into OUT_DIR instead, e.g. to compare two runs)

import { mkdirSync, rmSync, writeFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";

const SEED = 20261202;
const PER_GROUP = 12; // 8 undirected + 4 directed in every group
const FLOOR = 0.15; // weights below this are written as 0 = no edge
const SITE_SPACING = 0.2; // spacing of recording sites along a ring channel (arbitrary length units)
const REACH = 0.25; // length scale of the co-activity kernel exp(-d² / (2 REACH²))

// ---------------------------------------------------------------------------------------------------------
// Seeded random numbers: splitmix32 (a 32-bit variant of the splitmix construction), one stream per graph.

function splitmix32(seed) {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x9e3779b9) >>> 0;
    let z = state;
    z = Math.imul(z ^ (z >>> 16), 0x85ebca6b) >>> 0;
    z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35) >>> 0;
    z = (z ^ (z >>> 16)) >>> 0;
    return z / 4294967296;
  };
}

function makeRng(seed) {
  const next = splitmix32(seed);
  const rng = {
    uniform: (a = 0, b = 1) => a + (b - a) * next(),
    int: (a, b) => a + Math.floor(next() * (b - a + 1)), // inclusive
    normal: () => {
      const u = 1 - next(); // (0, 1]
      const v = next();
      return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
    },
    shuffle: (array) => {
      for (let i = array.length - 1; i > 0; i--) {
        const j = Math.floor(next() * (i + 1));
        [array[i], array[j]] = [array[j], array[i]];
      }
      return array;
    },
  };
  return rng;
}

// ---------------------------------------------------------------------------------------------------------
// Latent geometry: where the recording sites sit. Weights come from distances in this plane.

/** Sites along K ring-shaped channels laid side by side; neighbouring rings nearly touch. */
function ringSites(rng) {
  const rings = rng.int(2, 3);
  const perRing = rings === 2 ? rng.int(20, 34) : rng.int(15, 24);
  const radius = (perRing * SITE_SPACING) / (2 * Math.PI);
  const gap = 0.3;
  const points = [];
  const ringOf = [];
  const angle = [];
  for (let r = 0; r < rings; r++) {
    const cx = r * (2 * radius + gap);
    const turn = rng.uniform(0, 2 * Math.PI);
    for (let s = 0; s < perRing; s++) {
      const a = turn + (2 * Math.PI * (s + rng.uniform(-0.3, 0.3))) / perRing;
      const rr = radius + 0.03 * rng.normal();
      points.push([cx + rr * Math.cos(a), rr * Math.sin(a)]);
      ringOf.push(r);
      angle.push(a);
    }
  }
  return { points, ringOf, angle, parts: rings };
}

/** Sites in K tight islands (modules), islands far apart. */
function moduleSites(rng) {
  let modules;
  let sizes;
  do {
    modules = rng.int(3, 5);
    sizes = Array.from({ length: modules }, () => rng.int(8, 13));
  } while (sizes.reduce((a, b) => a + b, 0) < 30);
  const points = [];
  for (let m = 0; m < modules; m++) {
    const cx = 2 * Math.cos((2 * Math.PI * m) / modules) * (modules / 3);
    const cy = 2 * Math.sin((2 * Math.PI * m) / modules) * (modules / 3);
    for (let s = 0; s < sizes[m]; s++) {
      points.push([cx + 0.12 * rng.normal(), cy + 0.12 * rng.normal()]);
    }
  }
  return { points, parts: modules, sizes };
}

/** Co-activity of two sites at distance d: a Gaussian kernel with multiplicative and additive noise. */
function coActivity(rng, d) {
  const kernel = Math.exp(-(d * d) / (2 * REACH * REACH));
  const w = kernel * (1 + 0.12 * rng.normal()) + 0.08 * rng.uniform();
  return Math.min(1, Math.max(0, w));
}

function distance(p, q) {
  return Math.hypot(p[0] - q[0], p[1] - q[1]);
}

function round3(w) {
  return Math.round(w * 1000) / 1000;
}

/** Weight after the floor and rounding: 0 means "no edge". */
function keep(w) {
  const r = round3(w);
  return r >= FLOOR ? r : 0;
}

// ---------------------------------------------------------------------------------------------------------
// The three groups. Each returns { n, W (n×n array of arrays, 0 = no edge), coords or null }.
// W[i][j] is the weight of the edge i→j (directed) or of {i, j} (undirected, then W is symmetric).

function emptyMatrix(n) {
  return Array.from({ length: n }, () => new Array(n).fill(0));
}

function ringGraph(rng, directed) {
  const { points, ringOf, angle, parts } = ringSites(rng);
  const n = points.length;
  const W = emptyMatrix(n);
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const s = keep(coActivity(rng, distance(points[i], points[j])));
      if (s === 0) continue;
      if (!directed) {
        W[i][j] = s;
        W[j][i] = s;
        continue;
      }
      // Activity travels anticlockwise around every ring: the edge points from the site that fires first.
      let forward;
      if (ringOf[i] === ringOf[j]) {
        const delta = Math.atan2(Math.sin(angle[j] - angle[i]), Math.cos(angle[j] - angle[i]));
        forward = delta > 0;
      } else {
        forward = rng.uniform() < 0.5; // a link between two neighbouring rings: either way round
      }
      const [a, b] = forward ? [i, j] : [j, i];
      W[a][b] = s;
      // Some close pairs also drive each other back, more weakly: reciprocal pairs.
      if (rng.uniform() < 0.25) W[b][a] = keep(s * rng.uniform(0.4, 0.8));
    }
  }
  return { n, W, coords: points, parts };
}

function moduleGraph(rng, directed) {
  const { points, parts, sizes } = moduleSites(rng);
  const n = points.length;
  const W = emptyMatrix(n);
  // Within islands a random firing order: earlier sites drive later ones (directed graphs only).
  const order = rng.shuffle(Array.from({ length: n }, (_, i) => i));
  const rank = new Array(n);
  order.forEach((v, r) => {
    rank[v] = r;
  });
  const put = (i, j, s, reciprocalChance) => {
    if (!directed) {
      W[i][j] = s;
      W[j][i] = s;
      return;
    }
    const [a, b] = rank[i] < rank[j] ? [i, j] : [j, i];
    W[a][b] = s;
    if (rng.uniform() < reciprocalChance) W[b][a] = keep(s * rng.uniform(0.4, 0.8));
  };
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const s = keep(coActivity(rng, distance(points[i], points[j])));
      if (s !== 0) put(i, j, s, 0.08);
    }
  }
  // Weak bridges join island m to island m+1 (a chain, so no loop runs through the islands): one hub site of
  // island m links to two sites of island m+1 that are themselves linked, so the bridge is a filled triangle.
  let start = 0;
  for (let m = 0; m + 1 < parts; m++) {
    const next = start + sizes[m];
    const hub = start + rng.int(0, sizes[m] - 1);
    const [b1, b2] = linkedPair(W, next, sizes[m + 1], rng);
    const bridge = round3(rng.uniform(0.18, 0.32));
    put(hub, b1, bridge, 0);
    put(hub, b2, round3(bridge * rng.uniform(0.85, 1)), 0);
    start = next;
  }
  return { n, W, coords: points, parts };
}

/** Two sites of the island [start, start+size) joined by an edge (in either direction). */
function linkedPair(W, start, size, rng) {
  for (let tries = 0; tries < 1000; tries++) {
    const a = start + rng.int(0, size - 1);
    const b = start + rng.int(0, size - 1);
    if (a !== b && (W[a][b] > 0 || W[b][a] > 0)) return [a, b];
  }
  throw new Error("an island without an internal edge; change the seed");
}

/**
 * No structure: the weights of a freshly made ring or island graph, scattered over random node pairs. Same
 * number of sites, edges and the same weights as a structured graph; only the arrangement is random.
 * Redrawn until no site is isolated (so that edge-list files name every site).
 */
function scrambledGraph(rng, directed, template) {
  const source = template === "ring" ? ringGraph(rng, directed) : moduleGraph(rng, directed);
  const n = source.n;
  const weights = [];
  for (let i = 0; i < n; i++) {
    for (let j = directed ? 0 : i + 1; j < n; j++) if (source.W[i][j] > 0) weights.push(source.W[i][j]);
  }
  const slots = [];
  for (let i = 0; i < n; i++) {
    for (let j = directed ? 0 : i + 1; j < n; j++) if (i !== j) slots.push([i, j]);
  }
  for (let attempt = 0; attempt < 1000; attempt++) {
    rng.shuffle(slots);
    const W = emptyMatrix(n);
    const degree = new Array(n).fill(0);
    weights.forEach((w, e) => {
      const [i, j] = slots[e];
      W[i][j] = w;
      if (!directed) W[j][i] = w;
      degree[i]++;
      degree[j]++;
    });
    if (degree.every((d) => d > 0)) return { n, W, coords: null, parts: null };
  }
  throw new Error("could not scatter the weights without isolated sites; change the seed");
}

// ---------------------------------------------------------------------------------------------------------
// Writers. Numbers: shortest form of the 3-decimal value ("0.5", "1", "0").

const fmt = (w) => String(round3(w));

function siteNames(n) {
  return Array.from({ length: n }, (_, i) => `s${String(i + 1).padStart(2, "0")}`);
}

function denseText(W, names, sep) {
  const lines = [];
  if (names) lines.push(["", ...names].join(sep));
  W.forEach((row, i) => {
    const cells = row.map(fmt);
    lines.push((names ? [names[i], ...cells] : cells).join(sep));
  });
  return `${lines.join("\n")}\n`;
}

function edgeListText(W, names, directed) {
  const lines = ["source,target,weight"];
  const n = W.length;
  for (let i = 0; i < n; i++) {
    for (let j = directed ? 0 : i + 1; j < n; j++) {
      if (i !== j && W[i][j] > 0) lines.push(`${names[i]},${names[j]},${fmt(W[i][j])}`);
    }
  }
  return `${lines.join("\n")}\n`;
}

function coordsText(coords, names) {
  const lines = ["node,x,y"];
  coords.forEach(([x, y], i) => {
    lines.push(`${names[i]},${x.toFixed(3)},${y.toFixed(3)}`);
  });
  return `${lines.join("\n")}\n`;
}

// ---------------------------------------------------------------------------------------------------------
// The dataset plan. Every group gets the same mix of file formats, directedness and splits, so that none of
// them gives the label away.

const GROUPS = [
  { label: "ring", prefix: "ring" },
  { label: "islands", prefix: "isl" },
  { label: "scrambled", prefix: "scr" },
];

// Position within a group → [directed, format, split]
const PLAN = [
  [false, "dense-csv", "train"],
  [false, "dense-csv", "train"],
  [false, "dense-csv", "test"],
  [false, "dense-csv", "train"],
  [false, "dense-csv", "train"],
  [false, "dense-tsv", "train"],
  [false, "dense-txt", "test"],
  [false, "edges-csv", "train"],
  [true, "dense-csv", "train"],
  [true, "dense-csv", "train"],
  [true, "edges-csv", "test"],
  [true, "edges-csv", "train"],
];

const EXTENSION = {
  "dense-csv": ".csv",
  "dense-tsv": ".tsv",
  "dense-txt": ".txt",
  "edges-csv": ".edges.csv",
};

function permute(graph, perm) {
  // perm[newIndex] = oldIndex: hides the geometry that the generation order would show on the diagonal.
  const W = perm.map((oi) => perm.map((oj) => graph.W[oi][oj]));
  const coords = graph.coords ? perm.map((o) => graph.coords[o]) : null;
  return { ...graph, W, coords };
}

// ---------------------------------------------------------------------------------------------------------
// Recordings: spike trains of the recording sites, binned (1 = the site fired in that bin), for
// `cliquescape connect` and `extract --measure`. Three cultures per group, a smaller dish than the graphs':
// one ring channel, or three islands, or a scrambled control. See demo-data/README.md.

const RECORDING_SEED = 20261203;
const BINS = 600;
const RECORDINGS_PER_GROUP = 3;
const BACKGROUND = 0.004; // chance that a site fires in a bin on its own

/** Site spike trains for a ring: 18 sites round one channel; waves run round it, firing each site in passing. */
function ringRecording(rng) {
  const sites = 18;
  const angle = Array.from({ length: sites }, (_, s) => (2 * Math.PI * (s + rng.uniform(-0.2, 0.2))) / sites);
  const trains = Array.from({ length: sites }, () => new Array(BINS).fill(0));
  // A wave goes once round the ring in 27 bins (neighbouring sites fire 1 or 2 bins apart), either way round.
  for (let start = rng.int(0, 20); start < BINS; start += rng.int(35, 70)) {
    const from = rng.uniform(0, 2 * Math.PI);
    const direction = rng.uniform() < 0.5 ? 1 : -1;
    for (let s = 0; s < sites; s++) {
      if (rng.uniform() > 0.8) continue; // a site sometimes misses a wave
      const ahead = (((direction * (angle[s] - from)) % (2 * Math.PI)) + 2 * Math.PI) % (2 * Math.PI);
      const bin = start + Math.round((ahead / (2 * Math.PI)) * 27 + rng.uniform(-0.5, 0.5));
      if (bin < BINS) trains[s][bin] = 1;
    }
  }
  return background(rng, trains);
}

/** Three islands of 6 sites; each island bursts on its own, most of its sites firing within a bin or so. */
function islandRecording(rng) {
  const trains = Array.from({ length: 18 }, () => new Array(BINS).fill(0));
  for (let island = 0; island < 3; island++) {
    for (let burst = rng.int(0, 40); burst < BINS; burst += rng.int(30, 80)) {
      for (let s = 6 * island; s < 6 * island + 6; s++) {
        const bin = burst + rng.int(-1, 1);
        if (rng.uniform() < 0.8 && bin >= 0 && bin < BINS) trains[s][bin] = 1;
      }
    }
  }
  return background(rng, trains);
}

/** Control: a ring or islands culture's trains, each shifted round in time by its own random lag. */
function scrambledRecording(rng, template) {
  const trains = template === "ring" ? ringRecording(rng) : islandRecording(rng);
  return trains.map((train) => {
    const lag = rng.int(60, BINS - 60);
    return train.map((_, t) => train[(t + lag) % BINS]);
  });
}

function background(rng, trains) {
  for (const train of trains) for (let t = 0; t < BINS; t++) if (rng.uniform() < BACKGROUND) train[t] = 1;
  return trains;
}

/** Time bins × sites as CSV with a header of site names: the layout connect reads by default. */
function recordingCsv(trains, names) {
  const lines = [names.join(",")];
  for (let t = 0; t < BINS; t++) lines.push(trains.map((train) => train[t]).join(","));
  return `${lines.join("\n")}\n`;
}

/** The same as a NumPy .npy file of unsigned bytes (|u1), shape (bins, sites), written by hand (NEP 1). */
function recordingNpy(trains) {
  const dict = `{'descr': '|u1', 'fortran_order': False, 'shape': (${BINS}, ${trains.length}), }`;
  const total = 10 + dict.length + 1;
  const header = `${dict}${" ".repeat(Math.ceil(total / 64) * 64 - total)}\n`;
  const bytes = new Uint8Array(10 + header.length + BINS * trains.length);
  bytes.set([0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59, 1, 0, header.length & 0xff, header.length >> 8]);
  for (let k = 0; k < header.length; k++) bytes[10 + k] = header.charCodeAt(k);
  for (let t = 0; t < BINS; t++) {
    for (let s = 0; s < trains.length; s++) bytes[10 + header.length + t * trains.length + s] = trains[s][t];
  }
  return bytes;
}

function writeRecordings(out) {
  const folder = join(out, "recordings");
  rmSync(folder, { recursive: true, force: true });
  mkdirSync(folder, { recursive: true });
  const manifest = ["id,file,label"];
  let index = 0;
  for (const group of GROUPS) {
    for (let k = 0; k < RECORDINGS_PER_GROUP; k++) {
      const rng = makeRng((RECORDING_SEED + 104729 * ++index) >>> 0);
      let trains;
      if (group.label === "ring") trains = ringRecording(rng);
      else if (group.label === "islands") trains = islandRecording(rng);
      else trains = scrambledRecording(rng, k % 2 === 0 ? "ring" : "islands");
      // Sites in a random order, as in the graphs: the file order gives nothing away.
      const order = rng.shuffle(Array.from({ length: trains.length }, (_, s) => s));
      trains = order.map((s) => trains[s]);
      const id = `${group.prefix}-rec${k + 1}`;
      const file = k === 2 ? `${id}.npy` : `${id}.csv`;
      const data = k === 2 ? recordingNpy(trains) : recordingCsv(trains, siteNames(trains.length));
      writeFileSync(join(folder, file), data);
      manifest.push([id, file, group.label].join(","));
    }
  }
  writeFileSync(join(folder, "manifest.csv"), `${manifest.join("\n")}\n`);
  return index;
}

function main() {
  const here = dirname(fileURLToPath(import.meta.url));
  const out = process.argv[2] ?? here;
  for (const sub of ["graphs", "coords"]) {
    rmSync(join(out, sub), { recursive: true, force: true });
    mkdirSync(join(out, sub), { recursive: true });
  }
  const manifest = ["id,file,label,directed,split,nodes"];
  let graphIndex = 0;
  for (const group of GROUPS) {
    for (let k = 0; k < PER_GROUP; k++) {
      const [directed, format, split] = PLAN[k];
      const rng = makeRng((SEED + 7919 * ++graphIndex) >>> 0);
      let graph;
      if (group.label === "ring") graph = ringGraph(rng, directed);
      else if (group.label === "islands") graph = moduleGraph(rng, directed);
      else graph = scrambledGraph(rng, directed, k % 2 === 0 ? "ring" : "islands");
      graph = permute(graph, rng.shuffle(Array.from({ length: graph.n }, (_, i) => i)));
      const id = `${group.prefix}${String(k + 1).padStart(2, "0")}${directed ? "d" : "u"}`;
      const file = `graphs/${id}${EXTENSION[format]}`;
      const names = siteNames(graph.n);
      let text;
      if (format === "dense-csv") text = denseText(graph.W, names, ",");
      else if (format === "dense-tsv") text = denseText(graph.W, names, "\t");
      else if (format === "dense-txt") text = denseText(graph.W, null, " ");
      else text = edgeListText(graph.W, names, directed);
      writeFileSync(join(out, file), text);
      if (graph.coords) writeFileSync(join(out, "coords", `${id}.csv`), coordsText(graph.coords, names));
      manifest.push([id, file, group.label, directed, split, graph.n].join(","));
    }
  }
  writeFileSync(join(out, "manifest.csv"), `${manifest.join("\n")}\n`);
  const recordings = writeRecordings(out);
  process.stdout.write(
    `wrote ${manifest.length - 1} graphs and manifest.csv, and ${recordings} recordings in recordings/, to ${out}\n`,
  );
}

main();

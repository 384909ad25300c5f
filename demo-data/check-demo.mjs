#!/usr/bin/env node
// Checks the demo dataset without cliquescape itself (plain Node, no dependencies):
//  1. determinism: make-demo.mjs run twice into temporary folders writes byte-identical files, and those
//     files equal the committed ones;
//  2. a per-group summary computed here from the committed files by a deliberately naive, independent
//     implementation: sites, edges, density, largest simplex dimension, and at a few thresholds the simplex
//     counts of dimensions 0–2, the Euler characteristic of the whole complex, and β0, β1 over Z/2.
//     (β1 = dim C1 − rank ∂1 − rank ∂2, ranks by Gaussian elimination over Z/2: common practice.)
// Usage: node demo-data/check-demo.mjs   (exit code 1 if the determinism check fails)

import { execFileSync } from "node:child_process";
import { mkdtempSync, readdirSync, readFileSync, rmSync, statSync } from "node:fs";
import { tmpdir } from "node:os";
import { dirname, join, relative } from "node:path";
import { fileURLToPath } from "node:url";

const here = dirname(fileURLToPath(import.meta.url));
const THRESHOLDS = [0.8, 0.6, 0.4, 0.2];

// ---------------------------------------------------------------------------------------------------------
// 1. Determinism

function listFiles(root) {
  const out = [];
  const walk = (dir) => {
    for (const name of readdirSync(dir).sort()) {
      const path = join(dir, name);
      if (statSync(path).isDirectory()) walk(path);
      else out.push(relative(root, path));
    }
  };
  for (const sub of ["graphs", "coords", "recordings"]) walk(join(root, sub));
  out.push("manifest.csv");
  return out;
}

function sameTree(a, b) {
  const fa = listFiles(a);
  const fb = listFiles(b);
  if (fa.join("\n") !== fb.join("\n")) return `file lists differ (${fa.length} vs ${fb.length} files)`;
  for (const f of fa) if (!readFileSync(join(a, f)).equals(readFileSync(join(b, f)))) return `${f} differs`;
  return null;
}

function checkDeterminism() {
  const runs = [1, 2].map(() => {
    const dir = mkdtempSync(join(tmpdir(), "cliquescape-demo-"));
    execFileSync(process.execPath, [join(here, "make-demo.mjs"), dir]);
    return dir;
  });
  const problems = [];
  const twice = sameTree(runs[0], runs[1]);
  if (twice) problems.push(`two runs differ: ${twice}`);
  const committed = sameTree(runs[0], here);
  if (committed) problems.push(`a fresh run differs from the committed files: ${committed}`);
  const count = listFiles(runs[0]).length;
  for (const dir of runs) rmSync(dir, { recursive: true, force: true });
  if (problems.length) {
    for (const p of problems) process.stdout.write(`determinism: FAIL: ${p}\n`);
    return false;
  }
  process.stdout.write(
    `determinism: OK (two runs and the committed copy agree byte for byte, ${count} files)\n`,
  );
  return true;
}

// ---------------------------------------------------------------------------------------------------------
// Reading the demo formats back (only what make-demo.mjs writes).

function readGraph(file, directed) {
  const text = readFileSync(join(here, file), "utf8").trimEnd();
  const lines = text.split("\n");
  const arcs = []; // [u, v, w], u→v; undirected graphs list each pair once with u < v
  let n;
  if (file.endsWith(".edges.csv")) {
    const index = new Map();
    const id = (name) => {
      if (!index.has(name)) index.set(name, index.size);
      return index.get(name);
    };
    const rows = lines.slice(1).map((l) => l.split(","));
    for (const [s, t] of rows) {
      id(s);
      id(t);
    }
    n = index.size;
    for (const [s, t, w] of rows) arcs.push([id(s), id(t), Number(w)]);
  } else {
    const sep = file.endsWith(".tsv") ? "\t" : file.endsWith(".txt") ? " " : ",";
    const labelled = file.endsWith(".csv") || file.endsWith(".tsv");
    const rows = (labelled ? lines.slice(1) : lines).map((l) => {
      const cells = l.split(sep);
      return (labelled ? cells.slice(1) : cells).map(Number);
    });
    n = rows.length;
    for (let i = 0; i < n; i++) {
      for (let j = directed ? 0 : i + 1; j < n; j++)
        if (i !== j && rows[i][j] > 0) arcs.push([i, j, rows[i][j]]);
    }
  }
  return { n, arcs };
}

// ---------------------------------------------------------------------------------------------------------
// Naive complexes at one threshold (similarity weights: keep w ≥ W).

function outSets(n, arcs, directed, W) {
  const out = Array.from({ length: n }, () => new Set());
  for (const [u, v, w] of arcs) {
    if (w < W) continue;
    out[u].add(v);
    if (!directed) out[v].add(u);
  }
  return out;
}

/** Simplex counts per dimension: cliques (undirected; vertices in increasing order) or directed simplices. */
function simplexCounts(n, out, directed) {
  const counts = [];
  const extend = (simplex, candidates) => {
    const k = simplex.length - 1;
    counts[k] = (counts[k] ?? 0) + 1;
    for (const v of candidates) {
      const next = candidates.filter((c) => c !== v && out[v].has(c) && (directed || c > v));
      extend([...simplex, v], next);
    }
  };
  for (let v = 0; v < n; v++)
    extend(
      [v],
      [...out[v]].filter((c) => directed || c > v),
    );
  return counts;
}

function rankZ2(rows, width) {
  const words = Math.ceil(width / 32);
  const pivots = new Map(); // pivot column → reduced row
  let rank = 0;
  for (const cols of rows) {
    const row = new Uint32Array(words);
    for (const c of cols) row[c >>> 5] ^= 1 << (c & 31);
    for (;;) {
      let lead = -1;
      for (let w = words - 1; w >= 0 && lead < 0; w--) if (row[w]) lead = w * 32 + (31 - Math.clz32(row[w]));
      if (lead < 0) break;
      const p = pivots.get(lead);
      if (!p) {
        pivots.set(lead, row);
        rank++;
        break;
      }
      for (let w = 0; w < words; w++) row[w] ^= p[w];
    }
  }
  return rank;
}

function bettiLow(n, out, directed) {
  const edgeId = new Map();
  const key = (u, v) => u * 1000 + v;
  for (let u = 0; u < n; u++) {
    for (const v of out[u]) if (directed || u < v) edgeId.set(key(u, v), edgeId.size);
  }
  const e = edgeId.size;
  const rows1 = [...edgeId.keys()].map((k) => [Math.floor(k / 1000), k % 1000]);
  const rows2 = [];
  for (let a = 0; a < n; a++) {
    for (const b of out[a]) {
      if (!directed && b < a) continue;
      for (const c of out[b]) {
        if (!directed && c < b) continue;
        if (c !== a && out[a].has(c))
          rows2.push([edgeId.get(key(a, b)), edgeId.get(key(b, c)), edgeId.get(key(a, c))]);
      }
    }
  }
  const r1 = rankZ2(rows1, n);
  const r2 = rankZ2(rows2, Math.max(e, 1));
  return { b0: n - r1, b1: e - r1 - r2 };
}

// ---------------------------------------------------------------------------------------------------------
// 2. Summary

function summarise() {
  const manifest = readFileSync(join(here, "manifest.csv"), "utf8").trimEnd().split("\n").slice(1);
  const rows = [];
  for (const line of manifest) {
    const [id, file, label, directedText] = line.split(",");
    const directed = directedText === "true";
    const { n, arcs } = readGraph(file, directed);
    const full = simplexCounts(n, outSets(n, arcs, directed, 0), directed);
    const at = THRESHOLDS.map((W) => {
      const out = outSets(n, arcs, directed, W);
      const c = simplexCounts(n, out, directed);
      const euler = c.reduce((s, x, k) => s + (k % 2 ? -x : x), 0);
      return { c, euler, ...bettiLow(n, out, directed) };
    });
    const possible = directed ? n * (n - 1) : (n * (n - 1)) / 2;
    rows.push({
      id,
      label,
      directed,
      n,
      m: arcs.length,
      density: arcs.length / possible,
      top: full.length - 1,
      at,
    });
  }
  const mean = (xs) => xs.reduce((a, b) => a + b, 0) / xs.length;
  const f = (x) => x.toFixed(1).padStart(6);
  process.stdout.write(
    `\nper graph: id  n  edges  density  top-dim | at W=${THRESHOLDS.join(", ")}: c0/c1/c2  χ  β0  β1\n`,
  );
  for (const r of rows) {
    const parts = r.at.map(
      (a) => `${a.c[0]}/${a.c[1] ?? 0}/${a.c[2] ?? 0} χ=${a.euler} β0=${a.b0} β1=${a.b1}`,
    );
    process.stdout.write(`${r.id} ${r.n} ${r.m} ${r.density.toFixed(3)} ${r.top} | ${parts.join(" | ")}\n`);
  }
  process.stdout.write(
    `\ngroup means (sites, edges, density, top dimension; then χ, β0, β1 at W = ${THRESHOLDS.join(", ")})\n`,
  );
  for (const label of ["ring", "islands", "scrambled"]) {
    for (const directed of [false, true]) {
      const g = rows.filter((r) => r.label === label && r.directed === directed);
      const head = `${label.padEnd(9)} ${directed ? "directed  " : "undirected"} (${g.length}):`;
      const base = `${f(mean(g.map((r) => r.n)))}${f(mean(g.map((r) => r.m)))}  ${mean(g.map((r) => r.density)).toFixed(3)}${f(mean(g.map((r) => r.top)))}`;
      const per = THRESHOLDS.map(
        (_, t) =>
          `χ${f(mean(g.map((r) => r.at[t].euler)))} β0${f(mean(g.map((r) => r.at[t].b0)))} β1${f(mean(g.map((r) => r.at[t].b1)))}`,
      );
      process.stdout.write(`${head}${base} | ${per.join(" |")}\n`);
    }
  }
}

const ok = checkDeterminism();
summarise();
process.exitCode = ok ? 0 : 1;

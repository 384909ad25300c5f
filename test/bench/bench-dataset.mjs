// The batch benchmarks' dataset (extract-bench, cluster-bench): seeded dense similarity matrices as CSV
// files with a manifest, made once into a folder and kept (a stamp says with which sizes).
import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { seededRandom } from "./random.mjs";

/**
 * A dense similarity matrix: nodes at seeded random places in the unit square, similarity
 * exp(−d²/(2·0.3²)) times a random factor, plus a little noise, clipped to [0.001, 1] so every pair is an
 * edge. Two labels differ in how the places are drawn (uniform, or around three centres).
 */
function matrixCsv(n, seed, clustered) {
  const random = seededRandom(seed);
  const centres = [0, 1, 2].map(() => [random(), random()]);
  const points = Array.from({ length: n }, () => {
    if (!clustered) return [random(), random()];
    const c = centres[Math.floor(random() * 3)];
    return [c[0] + (random() - 0.5) * 0.35, c[1] + (random() - 0.5) * 0.35];
  });
  const m = Array.from({ length: n }, () => new Array(n).fill(0));
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const dx = points[i][0] - points[j][0];
      const dy = points[i][1] - points[j][1];
      const w = Math.exp(-(dx * dx + dy * dy) / (2 * 0.09)) * (0.85 + 0.3 * random()) + 0.05 * random();
      m[i][j] = m[j][i] = Math.min(1, Math.max(0.001, Math.round(w * 1e4) / 1e4));
    }
  }
  return `${m.map((row) => row.join(",")).join("\n")}\n`;
}

export function makeDataset(dir, graphs, nodes) {
  const stamp = join(dir, "made.json");
  const wanted = JSON.stringify({ graphs, nodes, version: 1 });
  if (existsSync(stamp) && readFileSync(stamp, "utf8") === wanted) return;
  rmSync(dir, { recursive: true, force: true });
  mkdirSync(dir, { recursive: true });
  const lines = ["id,file,label"];
  for (let g = 0; g < graphs; g++) {
    const id = `m${String(g).padStart(4, "0")}`;
    const clustered = g % 2 === 1;
    writeFileSync(join(dir, `${id}.csv`), matrixCsv(nodes, 1000 + g, clustered));
    lines.push(`${id},${id}.csv,${clustered ? "clustered" : "uniform"}`);
  }
  writeFileSync(join(dir, "manifest.csv"), `${lines.join("\n")}\n`);
  writeFileSync(stamp, wanted);
}

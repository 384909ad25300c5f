import { readdirSync, readFileSync, statSync, writeFileSync } from "node:fs";
import { join, relative } from "node:path";
import { expect } from "vitest";
import { seededRandom } from "../support/random.js";
import { matrixCsv, scratchFiles } from "./run-cli.js";

export interface FixtureGraph {
  id: string;
  label: string;
  directed: boolean;
  n: number;
  seed: number;
}

/**
 * A small dataset of seeded similarity matrices (weights in (0, 1], about 40 % of pairs without an edge),
 * written as dense CSV files with a manifest (id,file,label,directed,split). Returns the folder.
 */
export function similarityDataset(graphs: readonly FixtureGraph[]): string {
  const dir = scratchFiles({});
  const lines = ["id,file,label,directed,split"];
  graphs.forEach((g, i) => {
    writeFileSync(join(dir, `${g.id}.csv`), matrixCsv(similarityMatrix(g.n, g.directed, g.seed)));
    lines.push(`${g.id},${g.id}.csv,${g.label},${g.directed},${i % 3 === 0 ? "test" : "train"}`);
  });
  writeFileSync(join(dir, "manifest.csv"), `${lines.join("\n")}\n`);
  return dir;
}

/** An n×n similarity matrix, symmetric unless directed; weights rounded to 3 decimals so ties occur. */
export function similarityMatrix(n: number, directed: boolean, seed: number): (number | null)[][] {
  const random = seededRandom(seed);
  const m: (number | null)[][] = Array.from({ length: n }, () => Array<number | null>(n).fill(null));
  for (let i = 0; i < n; i++) {
    for (let j = directed ? 0 : i + 1; j < n; j++) {
      if (i === j) continue;
      const w = random() < 0.4 ? null : Math.max(0.001, Math.round(random() * 1000) / 1000);
      m[i][j] = w;
      if (!directed) m[j][i] = w;
    }
  }
  return m;
}

/** A few graphs of each of three labels, some directed: the dataset most extract tests run on. */
export const SMALL_DATASET: FixtureGraph[] = [
  { id: "a1", label: "alpha", directed: false, n: 14, seed: 11 },
  { id: "a2", label: "alpha", directed: false, n: 16, seed: 12 },
  { id: "b1", label: "beta", directed: true, n: 12, seed: 21 },
  { id: "b2", label: "beta", directed: false, n: 15, seed: 22 },
  { id: "c1", label: "gamma", directed: true, n: 10, seed: 31 },
  { id: "c2", label: "gamma", directed: false, n: 18, seed: 32 },
  { id: "c3", label: "gamma", directed: false, n: 13, seed: 33 },
];

/** Every file under `dir` (relative path → bytes), for byte-for-byte comparison of two run folders. */
export function folderContents(dir: string): Map<string, Buffer> {
  const out = new Map<string, Buffer>();
  const walk = (at: string) => {
    for (const name of readdirSync(at).sort()) {
      const path = join(at, name);
      if (statSync(path).isDirectory()) walk(path);
      else out.set(relative(dir, path), readFileSync(path));
    }
  };
  walk(dir);
  return out;
}

/** A CSV file written by extract, parsed (RFC 4180 quoting; no line breaks inside cells). */
export function readFeatureTable(path: string): { header: string[]; rows: string[][] } {
  const [head, ...rest] = readFileSync(path, "utf8").trimEnd().split("\n").map(csvCells);
  return { header: head, rows: rest };
}

function csvCells(line: string): string[] {
  const cells: string[] = [];
  let at = 0;
  while (at <= line.length) {
    if (line[at] === '"') {
      let cell = "";
      at++;
      while (at < line.length) {
        if (line[at] === '"' && line[at + 1] === '"') {
          cell += '"';
          at += 2;
        } else if (line[at] === '"') break;
        else cell += line[at++];
      }
      cells.push(cell);
      at += 2; // closing quote and comma
    } else {
      const end = line.indexOf(",", at);
      cells.push(line.slice(at, end < 0 ? line.length : end));
      at = end < 0 ? line.length + 1 : end + 1;
    }
  }
  return cells;
}

/**
 * Every file of the single run's folder is in the merged one with the same bytes, and the merged folder has
 * nothing more than the shard plan, the parts and the job scripts (a sharded run's own files).
 */
export function expectSameRun(single: string, merged: string): void {
  const a = folderContents(single);
  const b = folderContents(merged);
  for (const [name, bytes] of a) {
    expect(b.has(name), `${name} missing from the merged folder`).toBe(true);
    expect(b.get(name)!.equals(bytes), `${name} differs`).toBe(true);
  }
  const own = (name: string) =>
    name === "plan.json" || name.startsWith("parts/") || name.startsWith("slurm/");
  expect([...b.keys()].filter((name) => !a.has(name) && !own(name))).toEqual([]);
}

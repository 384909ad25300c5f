// The yardstick's plain edge-list format: first line "n m directed", then one "u v" per line (0-based).
import { readFileSync, writeFileSync } from "node:fs";

/** Reads a file into { n, directed, sources: Int32Array, targets: Int32Array }. */
export function readEdgeListFile(path) {
  const buf = readFileSync(path);
  let p = 0;
  const next = () => {
    while (p < buf.length && (buf[p] < 48 || buf[p] > 57)) p++;
    if (p >= buf.length) return -1;
    let x = 0;
    while (p < buf.length && buf[p] >= 48 && buf[p] <= 57) x = x * 10 + (buf[p++] - 48);
    return x;
  };
  const n = next();
  const m = next();
  const directed = next() !== 0;
  if (n < 0 || m < 0) throw new Error(`${path}: bad header`);
  const sources = new Int32Array(m);
  const targets = new Int32Array(m);
  for (let e = 0; e < m; e++) {
    const u = next();
    const v = next();
    if (u < 0 || v < 0) throw new Error(`${path}: ${m} edges announced, ${e} found`);
    sources[e] = u;
    targets[e] = v;
  }
  return { n, directed, sources, targets };
}

/** Writes a graph in the same format. */
export function writeEdgeListFile(path, { n, directed, sources, targets }) {
  const lines = [`${n} ${sources.length} ${directed ? 1 : 0}`];
  for (let e = 0; e < sources.length; e++) lines.push(`${sources[e]} ${targets[e]}`);
  writeFileSync(path, `${lines.join("\n")}\n`);
}

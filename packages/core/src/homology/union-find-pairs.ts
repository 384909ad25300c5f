import type { WorkMonitor } from "../work/work-monitor.js";
import type { CoboundaryModel } from "./coboundary-model.js";
import type { ByteLedger } from "./homology-budget.js";
import { KeyMap } from "./key-map.js";

/** A pairing found in one dimension: birth and death simplices by key and filtration value. */
export interface PairSink {
  pair(dim: number, birthKey: number, birthF: number, deathKey: number, deathF: number): void;
  essential(dim: number, birthKey: number, birthF: number): void;
}

/**
 * Dimension 0 by union–find over the edges in filtration order (R. E. Tarjan, "Efficiency of a good but
 * not linear set union algorithm", J. ACM 22, 1975). Every vertex is born at `start`; an edge joining two
 * components kills the younger one (the one whose oldest vertex has the larger index, as vertices enter in
 * index order), so the deaths are the weights of a minimum spanning forest (Kruskal's algorithm).
 * Returns the keys of the edges that killed a component: their columns are cleared in dimension 1.
 */
export function unionFindPairs(
  model: CoboundaryModel,
  start: number,
  ledger: ByteLedger,
  sink: PairSink,
  monitor: WorkMonitor,
): KeyMap {
  const n = model.vertexCount;
  const edges = model.listSimplices(1);
  monitor.begin("pairing components", 0, edges.count);
  const order = new Int32Array(edges.count);
  for (let i = 0; i < order.length; i++) order[i] = i;
  const { f, key } = edges;
  order.sort((a, b) => (f[a] !== f[b] ? (f[a] < f[b] ? -1 : 1) : key[a] - key[b]));
  ledger.reserve(n * 8, "union–find over the vertices");
  const parent = new Int32Array(n);
  const oldest = new Int32Array(n);
  for (let v = 0; v < n; v++) {
    parent[v] = v;
    oldest[v] = v;
  }
  const find = (v: number): number => {
    while (parent[v] !== v) {
      parent[v] = parent[parent[v]];
      v = parent[v];
    }
    return v;
  };
  const killers = new KeyMap(ledger, "recording the spanning-forest edges", Math.max(16, n));
  const ends = new Int32Array(2);
  for (let i = 0; i < order.length; i++) {
    if ((i & 65535) === 0) monitor.check(i);
    const e = order[i];
    model.vertices(1, key[e], ends);
    const a = find(ends[0]);
    const b = find(ends[1]);
    if (a === b) continue;
    const younger = Math.max(oldest[a], oldest[b]);
    const elder = Math.min(oldest[a], oldest[b]);
    parent[a] = b;
    oldest[b] = elder;
    sink.pair(0, younger, start, key[e], f[e]);
    killers.set(key[e], 0);
  }
  for (let v = 0; v < n; v++) if (find(v) === v) sink.essential(0, oldest[v], start);
  ledger.release(n * 8);
  return killers;
}

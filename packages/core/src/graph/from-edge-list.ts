import { checkWeight } from "./check-weight.js";
import { GraphInputError } from "./graph-input-error.js";
import { type NegativePolicy, noteNegatives, type WarningSink } from "./policies.js";
import type { WeightedGraph } from "./weighted-graph.js";

export interface EdgeListInput {
  n: number;
  sources: ArrayLike<number>;
  targets: ArrayLike<number>;
  weights: ArrayLike<number>;
  directed: boolean;
  labels?: readonly string[];
  /** Default "error". */
  negative?: NegativePolicy;
  onWarning?: WarningSink;
}

// Row-local sort key: target in the high part, position in the low 26 bits; exact in a float64.
const POSITION_BITS = 2 ** 26;

/**
 * Builds a CSR graph from parallel arrays of edges. Undirected edges may be given in either direction,
 * once each; a pair given twice (in any direction) is a duplicate and an error naming both positions.
 * Self-loops are dropped with a warning.
 */
export function fromEdgeList(input: EdgeListInput): WeightedGraph {
  const { n, sources, targets, weights, directed } = input;
  const negative = input.negative ?? "error";
  const m = sources.length;
  if (targets.length !== m || weights.length !== m) {
    throw new GraphInputError("bad-shape", "sources, targets and weights differ in length");
  }
  if (input.labels && input.labels.length !== n) {
    throw new GraphInputError("bad-shape", `${input.labels.length} labels for ${n} nodes`);
  }
  if (n >= POSITION_BITS) throw new GraphInputError("bad-shape", `too many nodes (${n})`);

  const kept = new Float64Array(m);
  const degree = new Int32Array(n + 1);
  let selfLoops = 0;
  let negatives = 0;
  for (let e = 0; e < m; e++) {
    const u = sources[e];
    const v = targets[e];
    for (const x of [u, v]) {
      if (!Number.isInteger(x) || x < 0 || x >= n) {
        throw new GraphInputError("node-out-of-range", `node ${x} is not in 0..${n - 1}`, { edge: e });
      }
    }
    const w = checkWeight(weights[e], negative, () => ({ edge: e }));
    if (weights[e] < 0 && u !== v) negatives++;
    if (u === v) {
      selfLoops++;
      kept[e] = Number.NaN;
      continue;
    }
    kept[e] = w;
    if (Number.isNaN(w)) continue;
    degree[u + 1]++;
    if (!directed) degree[v + 1]++;
  }
  noteNegatives(negatives, negative, input.onWarning);
  if (selfLoops > 0) input.onWarning?.(`dropped ${selfLoops} self-loop${selfLoops === 1 ? "" : "s"}`);

  const offsets = new Int32Array(n + 1);
  for (let u = 0; u < n; u++) offsets[u + 1] = offsets[u] + degree[u + 1];
  const slots = offsets[n];
  const fill = offsets.slice(0, n);
  const slotTarget = new Int32Array(slots);
  const slotOrigin = new Int32Array(slots);
  for (let e = 0; e < m; e++) {
    if (Number.isNaN(kept[e])) continue;
    const u = sources[e];
    const v = targets[e];
    slotTarget[fill[u]] = v;
    slotOrigin[fill[u]++] = e;
    if (!directed) {
      slotTarget[fill[v]] = u;
      slotOrigin[fill[v]++] = e;
    }
  }

  const outTargets = new Int32Array(slots);
  const outWeights = new Float64Array(slots);
  const keys = new Float64Array(slots);
  for (let u = 0; u < n; u++) {
    const start = offsets[u];
    const end = offsets[u + 1];
    for (let s = start; s < end; s++) keys[s] = slotTarget[s] * POSITION_BITS + (s - start);
    const row = keys.subarray(start, end).sort();
    let previous = -1;
    for (let i = 0; i < row.length; i++) {
      const local = row[i] % POSITION_BITS;
      const v = (row[i] - local) / POSITION_BITS;
      const e = slotOrigin[start + local];
      if (v === previous) {
        const first = slotOrigin[start + (row[i - 1] % POSITION_BITS)];
        throw new GraphInputError("duplicate-edge", `edge ${u}-${v} is given more than once`, {
          edge: Math.max(e, first),
          firstEdge: Math.min(e, first),
        });
      }
      previous = v;
      outTargets[start + i] = v;
      outWeights[start + i] = kept[e];
    }
  }
  return { n, directed, offsets, targets: outTargets, weights: outWeights, labels: input.labels };
}

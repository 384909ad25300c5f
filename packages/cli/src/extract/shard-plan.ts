/**
 * Splitting a dataset into shards for separate processes (array jobs on a cluster). Pure functions over
 * plain data: the same graph sizes and shard count always give the same split, on any machine.
 */

/** What the plan knows of one graph: its id and estimated cost (from its size after preparation). */
export interface PlannedGraph {
  id: string;
  cost: number;
}

/**
 * Estimated cost of one graph: its nodes and edges plus the expected number of simplices of dimension
 * 2 .. topDim in a random graph of the same size and density, which is what the enumeration and the
 * homology grow with. Expected k-cliques of an Erdős–Rényi graph G(n, p): C(n, k) p^C(k,2) (Erdős & Rényi,
 * "On the evolution of random graphs", 1960; Bollobás, "Random Graphs", 2nd ed. 2001, ch. 4); a directed
 * flag simplex is an ordered k-tuple with all k(k−1)/2 forward arcs, n!/(n−k)! p^C(k,2) expected, with p
 * the arc density. An estimate for balancing only: real graphs cluster more than random ones.
 * A graph that could not be read costs 1 (it fails at once when computed).
 */
export function estimatedCost(
  size: { nodes: number; edges: number; directed: boolean } | null,
  topDim: number,
): number {
  if (size === null) return 1;
  const { nodes: n, edges: m, directed } = size;
  const pairs = directed ? n * (n - 1) : (n * (n - 1)) / 2;
  const p = pairs > 0 ? Math.min(1, m / pairs) : 0;
  let cost = n + m;
  // tuples: C(n, k) (or n!/(n−k)! when directed), built up factor by factor.
  let tuples = directed ? n * (n - 1) : (n * (n - 1)) / 2;
  for (let k = 3; k <= topDim + 1 && k <= n; k++) {
    tuples = directed ? tuples * (n - k + 1) : (tuples * (n - k + 1)) / k;
    cost += tuples * p ** ((k * (k - 1)) / 2);
  }
  return Number.isFinite(cost) ? cost : Number.MAX_VALUE;
}

/**
 * Greedy longest-processing-time partition (Graham, "Bounds on multiprocessing timing anomalies", SIAM J.
 * Appl. Math. 17, 1969: within 4/3 − 1/(3N) of the best makespan): graphs by decreasing cost, each to the
 * shard with the least cost so far (ties: the lowest shard number). Graphs of equal estimated cost are
 * taken in the order of a hash of their id (then by id, then dataset position): in id order they would be
 * dealt out in turn, and a dataset listed as subject 1 rest, subject 1 task, subject 2 rest, … gave every
 * "rest" graph to one of two shards. Returns, per shard, the dataset positions of its graphs in dataset
 * order. Every graph is in exactly one shard; the result depends only on the costs, the ids and N.
 */
export function partitionGraphs(graphs: readonly PlannedGraph[], shards: number): number[][] {
  if (!Number.isInteger(shards) || shards < 1)
    throw new RangeError(`shard count ${shards}: not a positive integer`);
  const order = graphs.map((_, i) => i);
  const mixed = Uint32Array.from(graphs, (g) => idHash(g.id));
  order.sort((a, b) => {
    const byCost = graphs[b].cost - graphs[a].cost;
    if (byCost !== 0) return byCost;
    if (mixed[a] !== mixed[b]) return mixed[a] - mixed[b];
    const x = graphs[a].id;
    const y = graphs[b].id;
    return x < y ? -1 : x > y ? 1 : a - b;
  });
  const heap = new ShardHeap(shards);
  const owner = new Int32Array(graphs.length);
  for (const i of order) owner[i] = heap.takeLightest(graphs[i].cost);
  const parts: number[][] = Array.from({ length: shards }, () => []);
  for (let i = 0; i < graphs.length; i++) parts[owner[i]].push(i);
  return parts;
}

/**
 * 32-bit FNV-1a of the id's UTF-16 code units (Fowler, Noll, Vo; the parameters of the FNV reference,
 * IETF draft-eastlake-fnv): ids that differ in one character land far apart, so the order it gives has no
 * period a dataset's layout could share.
 */
export function idHash(id: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < id.length; i++) h = Math.imul(h ^ id.charCodeAt(i), 0x01000193);
  return h >>> 0;
}

/** The shards' loads in a binary min-heap ordered by (load, shard number), so N may be large. */
class ShardHeap {
  private readonly load: Float64Array;
  private readonly heap: Int32Array;

  constructor(size: number) {
    this.load = new Float64Array(size);
    this.heap = Int32Array.from({ length: size }, (_, i) => i);
  }

  /** Adds `cost` to the lightest shard and returns its number. */
  takeLightest(cost: number): number {
    const shard = this.heap[0];
    this.load[shard] += cost;
    this.siftDown(0);
    return shard;
  }

  private lighter(a: number, b: number): boolean {
    const la = this.load[a];
    const lb = this.load[b];
    return la < lb || (la === lb && a < b);
  }

  private siftDown(at: number): void {
    const { heap } = this;
    const n = heap.length;
    for (;;) {
      const left = 2 * at + 1;
      if (left >= n) return;
      const right = left + 1;
      const child = right < n && this.lighter(heap[right], heap[left]) ? right : left;
      if (!this.lighter(heap[child], heap[at])) return;
      [heap[at], heap[child]] = [heap[child], heap[at]];
      at = child;
    }
  }
}

/** "I/N" with 0 ≤ I < N (array-job task numbers start at 0), as given to `extract --shard`. */
export function parseShard(text: string): { index: number; count: number } {
  const match = /^(\d+)\/(\d+)$/.exec(text.trim());
  if (!match) throw new RangeError(`expected I/N (shard I of N, counted from 0), got "${text}"`);
  const index = Number(match[1]);
  const count = Number(match[2]);
  if (count < 1) throw new RangeError(`--shard ${text}: N must be at least 1`);
  if (index >= count)
    throw new RangeError(`--shard ${text}: I counts from 0, so it must be below N (${count})`);
  return { index, count };
}

/** The folder name of shard I of N inside the run folder's parts/ folder. */
export function shardName(index: number, count: number): string {
  return `${index}-of-${count}`;
}

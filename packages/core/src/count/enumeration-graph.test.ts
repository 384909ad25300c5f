import { describe, expect, it } from "vitest";
import { fromEdgeList } from "../graph/from-edge-list.js";
import type { WeightedGraph } from "../graph/weighted-graph.js";
import { degeneracyOrder } from "./degeneracy-order.js";
import { buildEnumerationGraph, type EnumerationGraph, reverseSlots } from "./enumeration-graph.js";

function graph(n: number, edges: [number, number, number][], directed: boolean): WeightedGraph {
  return fromEdgeList({
    n,
    directed,
    sources: edges.map((e) => e[0]),
    targets: edges.map((e) => e[1]),
    weights: edges.map((e) => e[2]),
  });
}

/** The source vertex of each CSR slot of `g`. */
function sourceOfSlot(g: WeightedGraph): number[] {
  const source: number[] = [];
  for (let u = 0; u < g.n; u++) for (let s = g.offsets[u]; s < g.offsets[u + 1]; s++) source[s] = u;
  return source;
}

/** The lists of `e`, as [root, neighbour, slot] in input numbering, and the list lengths. */
function entries(e: EnumerationGraph) {
  const rows: [number, number, number][] = [];
  const lengths: number[] = [];
  for (let r = 0; r < e.n; r++) {
    lengths.push(e.offsets[r + 1] - e.offsets[r]);
    for (let p = e.offsets[r]; p < e.offsets[r + 1]; p++)
      rows.push([e.vertexOf[r], e.vertexOf[e.targets[p]], e.slots[p]]);
  }
  return { rows, lengths };
}

// vertices 0..5: a triangle 0-1-2 with weights 1, 2, 3; a path 2-3-4 with weights 4, 5; vertex 5 alone
const edges: [number, number, number][] = [
  [0, 1, 1],
  [1, 2, 2],
  [0, 2, 3],
  [2, 3, 4],
  [3, 4, 5],
];

describe("buildEnumerationGraph, directed: the out-lists as they are, less the masked arcs", () => {
  // arcs in both directions on the triangle, one way on the path
  const arcs: [number, number, number][] = [...edges, [1, 0, 6], [2, 1, 7], [2, 0, 8]];
  const g = graph(6, arcs, true);
  const source = sourceOfSlot(g);

  it("no mask: every arc once, from its source, with its own slot; vertices keep their numbers", () => {
    const e = buildEnumerationGraph(g, null);
    expect(e.directed).toBe(true);
    expect(e.n).toBe(6);
    expect(Array.from(e.vertexOf)).toEqual([0, 1, 2, 3, 4, 5]);
    const { rows, lengths } = entries(e);
    expect(lengths).toEqual([2, 2, 3, 1, 0, 0]);
    expect(e.maxList).toBe(3);
    for (const [u, v, s] of rows) {
      expect(source[s]).toBe(u);
      expect(g.targets[s]).toBe(v);
    }
    expect(rows.map((r) => r[2]).sort((a, b) => a - b)).toEqual(Array.from({ length: 8 }, (_, s) => s));
  });

  it("a mask drops the arcs with a negative entry and keeps the slots of the others", () => {
    // keep only arcs of weight ≤ 4: drops 3→4 (5) and the reverse arcs 1→0, 2→1, 2→0 (6, 7, 8)
    const mask = Int32Array.from(g.weights, (w) => (w <= 4 ? 0 : -1));
    const e = buildEnumerationGraph(g, mask);
    const { rows, lengths } = entries(e);
    expect(lengths).toEqual([2, 1, 1, 0, 0, 0]);
    expect(e.maxList).toBe(2);
    expect(rows.map(([u, v, s]) => [u, v, g.weights[s]])).toEqual([
      [0, 1, 1],
      [0, 2, 3],
      [1, 2, 2],
      [2, 3, 4],
    ]);
  });
});

describe("buildEnumerationGraph, undirected: degeneracy numbering, later neighbours only, sorted", () => {
  const g = graph(6, edges, false);
  const source = sourceOfSlot(g);

  /** Each kept edge once, from its endpoint with the smaller new number; lists ascending; slots real. */
  function checkUndirected(e: EnumerationGraph, kept: [number, number, number][]) {
    expect(e.directed).toBe(false);
    const rank = new Int32Array(e.n);
    e.vertexOf.forEach((v, r) => {
      rank[v] = r;
    });
    for (let r = 0; r < e.n; r++) {
      const list = Array.from(e.targets.subarray(e.offsets[r], e.offsets[r + 1]));
      expect(list).toEqual([...list].sort((a, b) => a - b));
      for (const t of list) expect(t).toBeGreaterThan(r);
    }
    const { rows, lengths } = entries(e);
    expect(e.maxList).toBe(Math.max(0, ...lengths));
    // the slot is the edge's entry in the later endpoint's row, pointing at the earlier endpoint
    for (const [u, v, s] of rows) {
      expect(source[s]).toBe(v);
      expect(g.targets[s]).toBe(u);
      expect(rank[u]).toBeLessThan(rank[v]);
    }
    const asPairs = (list: [number, number, number][]) =>
      list.map(([u, v, w]) => [Math.min(u, v), Math.max(u, v), w]).sort((a, b) => a[2] - b[2]);
    expect(asPairs(rows.map(([u, v, s]) => [u, v, g.weights[s]]))).toEqual(asPairs(kept));
  }

  it("no mask: the numbering is the degeneracy order of the whole graph", () => {
    const e = buildEnumerationGraph(g, null);
    expect(Array.from(e.vertexOf)).toEqual(Array.from(degeneracyOrder(g.n, g.offsets, g.targets)));
    checkUndirected(e, edges);
  });

  it("a mask: the numbering is the degeneracy order of the kept subgraph, slots are the input's", () => {
    // keep weights 2, 4, 5 (a path 1-2-3-4): its degeneracy order differs from the whole graph's
    const keep = (w: number) => w === 2 || w >= 4;
    // a kept edge may have mask entry 0 (the first bin of a sweep, or a plain threshold)
    const mask = Int32Array.from(g.weights, (w) => (keep(w) ? (w === 2 ? 0 : 3) : -1));
    const e = buildEnumerationGraph(g, mask);
    const sub = graph(
      6,
      edges.filter((x) => keep(x[2])),
      false,
    );
    expect(Array.from(e.vertexOf)).toEqual(Array.from(degeneracyOrder(sub.n, sub.offsets, sub.targets)));
    expect(Array.from(e.vertexOf)).not.toEqual(Array.from(degeneracyOrder(g.n, g.offsets, g.targets)));
    checkUndirected(
      e,
      edges.filter((x) => keep(x[2])),
    );
  });

  it("a hub with many neighbours gets the longest list only if it comes early; maxList is the longest", () => {
    // star on 0 with leaves 1..5 plus the edge 4-5: the leaves peel first, so every list has length ≤ 2
    const star = graph(
      6,
      [
        [0, 1, 1],
        [0, 2, 1],
        [0, 3, 1],
        [0, 4, 1],
        [0, 5, 1],
        [4, 5, 1],
      ],
      false,
    );
    const e = buildEnumerationGraph(star, null);
    expect(e.maxList).toBeLessThanOrEqual(2);
    expect(e.offsets[6]).toBe(6);
  });
});

describe("reverseSlots", () => {
  it("pairs each undirected edge's two slots", () => {
    const g = graph(6, edges, false);
    const source = sourceOfSlot(g);
    const reverse = reverseSlots(g);
    expect(reverse.length).toBe(10);
    for (let s = 0; s < reverse.length; s++) {
      expect(reverse[reverse[s]]).toBe(s);
      expect(reverse[s]).not.toBe(s);
      expect(source[reverse[s]]).toBe(g.targets[s]);
      expect(g.targets[reverse[s]]).toBe(source[s]);
      expect(g.weights[reverse[s]]).toBe(g.weights[s]);
    }
  });
});

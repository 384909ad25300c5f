import { describe, expect, it } from "vitest";
import { fromEdgeList } from "../graph/from-edge-list.js";
import { degeneracyOrder } from "./degeneracy-order.js";

/** Undirected graph with both directions of every edge in its lists, as degeneracyOrder expects. */
function lists(n: number, edges: [number, number][]) {
  const g = fromEdgeList({
    n,
    directed: false,
    sources: edges.map((e) => e[0]),
    targets: edges.map((e) => e[1]),
    weights: edges.map(() => 1),
  });
  return { offsets: g.offsets, targets: g.targets };
}

/** For each position, the neighbours of that vertex placed later in the order. */
function laterNeighbours(n: number, offsets: Int32Array, targets: Int32Array, order: Int32Array): number[] {
  const position = new Int32Array(n);
  order.forEach((v, i) => {
    position[v] = i;
  });
  return Array.from(order, (v) => {
    let later = 0;
    for (let s = offsets[v]; s < offsets[v + 1]; s++) if (position[targets[s]] > position[v]) later++;
    return later;
  });
}

/**
 * Worked by hand. In a peeling order the largest number of later neighbours met so far equals the core
 * number of the vertex at that position (the level of the peeling when it was removed: D. W. Matula and
 * L. L. Beck, J. ACM 30(3), 1983; V. Batagelj and M. Zaversnik, 2003). So the checks are: a permutation,
 * and the running maximum of later neighbours, read at each vertex, is that vertex's core number.
 */
function check(n: number, edges: [number, number][], core: number[]) {
  const { offsets, targets } = lists(n, edges);
  const order = degeneracyOrder(n, offsets, targets);
  expect([...order].sort((a, b) => a - b)).toEqual(Array.from({ length: n }, (_, i) => i));
  const later = laterNeighbours(n, offsets, targets, order);
  let level = 0;
  const seen = later.map((l) => {
    level = Math.max(level, l);
    return level;
  });
  expect(seen).toEqual(Array.from(order, (v) => core[v]));
  return { order: Array.from(order), later };
}

describe("degeneracyOrder (smallest-last peeling)", () => {
  it("no vertices, and isolated vertices only", () => {
    expect(Array.from(degeneracyOrder(0, new Int32Array(1), new Int32Array(0)))).toEqual([]);
    check(3, [], [0, 0, 0]);
  });

  it("a path 0–1–2–3 is 1-degenerate: every vertex has at most one later neighbour", () => {
    const { later } = check(
      4,
      [
        [0, 1],
        [1, 2],
        [2, 3],
      ],
      [1, 1, 1, 1],
    );
    expect(later.slice(0, 3)).toEqual([1, 1, 1]);
    expect(later[3]).toBe(0);
  });

  it("K4 with a pendant vertex: the pendant goes first, then the K4 at level 3", () => {
    // core numbers by hand: the pendant vertex 4 (degree 1) is the 1-core's only member outside the 3-core
    const { order, later } = check(
      5,
      [
        [0, 1],
        [0, 2],
        [0, 3],
        [1, 2],
        [1, 3],
        [2, 3],
        [0, 4],
      ],
      [3, 3, 3, 3, 1],
    );
    expect(order[0]).toBe(4);
    expect(later).toEqual([1, 3, 2, 1, 0]);
  });

  it("a hub listed first, joined to a triangle and a tail: degrees fall as neighbours are peeled", () => {
    // vertex 0 joined to 1..5; triangle 0-1-2; tail 5-6-7. Core numbers by hand: {0, 1, 2} form the
    // 2-core (a triangle); everything else peels at level 1.
    check(
      8,
      [
        [0, 1],
        [0, 2],
        [0, 3],
        [0, 4],
        [0, 5],
        [1, 2],
        [5, 6],
        [6, 7],
      ],
      [2, 2, 2, 1, 1, 1, 1, 1],
    );
  });

  it("two K4s joined by a path of two edges, vertices interleaved in the input numbering", () => {
    // K4 on {0, 2, 4, 6}, K4 on {1, 3, 5, 7}, path 6–8–7: core 3 on the K4s; vertex 8 has degree 2 and
    // every vertex has degree ≥ 2, so the whole graph is the 2-core and 8's core number is 2
    const k4 = (a: number[]) => a.flatMap((u, i) => a.slice(i + 1).map((v) => [u, v] as [number, number]));
    check(9, [...k4([0, 2, 4, 6]), ...k4([1, 3, 5, 7]), [6, 8], [8, 7]], [3, 3, 3, 3, 3, 3, 3, 3, 2]);
  });
});

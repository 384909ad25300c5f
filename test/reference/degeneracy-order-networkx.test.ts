/**
 * The degeneracy (smallest-last) order that numbers the vertices of an undirected clique enumeration
 * (packages/core/src/count/degeneracy-order.ts), checked against networkx's k-core decomposition
 * (`networkx.core_number`, Debian's python3-networkx) in test/support/python/core_numbers.py.
 *
 * The counts do not depend on the order, so no counting test can see a wrong one; what the order promises
 * is a bound: every vertex has at most `degeneracy` neighbours later in it (the degeneracy being the
 * largest core number). Peeling at the lowest level left removes each vertex at its core number, so the
 * running maximum of later neighbours, read at each position, is the core number of the vertex there
 * (D. W. Matula and L. L. Beck, "Smallest-last ordering and clustering and graph coloring algorithms",
 * J. ACM 30(3), 1983; V. Batagelj and M. Zaversnik, "An O(m) algorithm for cores decomposition of
 * networks", 2003; the per-vertex form derived from the peeling, not quoted).
 */
import { fromEdgeList } from "@cliquescape/core";
import { describe, expect, it } from "vitest";
import { degeneracyOrder } from "../../packages/core/src/count/degeneracy-order.js";
import { missingPythonModules, runPythonScript } from "../support/python.js";

interface Cores {
  n: number;
  edges: [number, number][];
  core: number[];
}

const missing = missingPythonModules(["networkx"]);
const suite = missing ? describe.skip : describe;
const skipNote = missing ? ` (skipped: ${missing})` : "";

/** Orders networkx's graph with degeneracyOrder and compares it with networkx's core numbers. */
function checkAgainstNetworkx(spec: Record<string, unknown>): Cores {
  const ref = runPythonScript<Cores>("core_numbers.py", spec);
  const { n, edges, core } = ref;
  const g = fromEdgeList({
    n,
    directed: false,
    sources: edges.map((e) => e[0]),
    targets: edges.map((e) => e[1]),
    weights: edges.map(() => 1),
  });
  const order = degeneracyOrder(n, g.offsets, g.targets);
  // a permutation of the vertices
  expect([...order].sort((a, b) => a - b)).toEqual(Array.from({ length: n }, (_, i) => i));
  const position = new Int32Array(n);
  order.forEach((v, i) => {
    position[v] = i;
  });
  const degeneracy = Math.max(0, ...core);
  let level = 0;
  const levels: number[] = [];
  for (const v of order) {
    let later = 0;
    for (let s = g.offsets[v]; s < g.offsets[v + 1]; s++) if (position[g.targets[s]] > position[v]) later++;
    // smallest-last: at most `degeneracy` later neighbours (networkx core_number: degeneracy = max core)
    expect(later).toBeLessThanOrEqual(core[v]);
    level = Math.max(level, later);
    levels.push(level);
  }
  // the peeling level at each vertex is its core number (networkx core_number)
  expect(levels).toEqual(Array.from(order, (v) => core[v]));
  expect(level).toBe(degeneracy);
  return ref;
}

suite(`degeneracy order against networkx's core numbers${skipNote}`, () => {
  it("Zachary's karate club (34 members, 78 ties; degeneracy 4)", () => {
    // W. W. Zachary, "An information flow model for conflict and fission in small groups",
    // J. Anthropological Research 33(4), 1977, as networkx.karate_club_graph() ships it.
    const ref = checkAgainstNetworkx({ graph: "karate" });
    expect(ref.n).toBe(34);
    expect(ref.edges.length).toBe(78);
    expect(Math.max(...ref.core)).toBe(4);
  });

  it("Les Misérables co-appearances, the Florentine families, Davis's southern women", () => {
    // D. E. Knuth, The Stanford GraphBase, 1993 (networkx.les_miserables_graph); J. F. Padgett and
    // C. K. Ansell, Amer. J. Sociology 98(6), 1993 (networkx.florentine_families_graph); A. Davis,
    // B. B. Gardner and M. R. Gardner, Deep South, 1941 (networkx.davis_southern_women_graph, bipartite).
    const lesmis = checkAgainstNetworkx({ graph: "lesmis" });
    expect(lesmis.n).toBe(77);
    // several levels, so the order has to move vertices between buckets
    expect(new Set(lesmis.core).size).toBeGreaterThan(4);
    checkAgainstNetworkx({ graph: "florentine" });
    checkAgainstNetworkx({ graph: "davis" });
  });

  it("seeded random graphs: G(n, p) of several densities and preferential attachment", () => {
    // networkx.gnp_random_graph and networkx.barabasi_albert_graph (every vertex after the first m
    // arrives with m edges, so the degeneracy is m: checked below against networkx's own core numbers)
    for (const [n, p, seed] of [
      [60, 0.05, 1],
      [60, 0.2, 2],
      [40, 0.6, 3],
    ]) {
      checkAgainstNetworkx({ graph: "gnp", n, p, seed });
    }
    const ba = checkAgainstNetworkx({ graph: "ba", n: 120, m: 3, seed: 4 });
    expect(Math.max(...ba.core)).toBe(3);
  });
});

import { describe, expect, it } from "vitest";
import { completeGraph } from "../../../../test/support/known-graphs.js";
import { NotingMonitor } from "../../../../test/support/noting-monitor.js";
import { edgeFiltration } from "../filtration/edge-filtration.js";
import { fromEdgeList } from "../graph/from-edge-list.js";
import type { WeightedGraph } from "../graph/weighted-graph.js";
import { CliqueCoboundaries } from "./clique-coboundaries.js";
import { ByteLedger } from "./homology-budget.js";
import { SimplexQuota } from "./simplex-quota.js";
import { unionFindPairs } from "./union-find-pairs.js";

/** A ledger that notes each reservation. */
class NotingLedger extends ByteLedger {
  noted: [string, number][] = [];
  override reserve(bytes: number, stage: string): void {
    this.noted.push([stage, bytes]);
    super.reserve(bytes, stage);
  }
}

/** The clique model of a graph (distances, sparse rows) with its edges listed, and the ledger noting from then. */
function edgesListed(graph: WeightedGraph) {
  const ledger = new NotingLedger(undefined);
  const monitor = new NotingMonitor(undefined);
  const model = new CliqueCoboundaries(
    graph,
    edgeFiltration(graph, "distance"),
    2,
    "sparse",
    ledger,
    monitor,
    new SimplexQuota(undefined, 2),
  );
  model.listSimplices(1);
  return { ledger, monitor, model };
}

describe("unionFindPairs", () => {
  it("pairs components by Kruskal's order with the elder rule, and holds 8 bytes a vertex while it runs", () => {
    // Worked by hand: edges 0–1 (1), 2–3 (2), 1–2 (3), 0–3 (4). 0–1 kills vertex 1's component, 2–3 kills
    // 3's, 1–2 joins {0, 1} and {2, 3} and kills the younger, whose oldest vertex is 2; 0–3 closes a loop.
    // Edge keys in the combinatorial number system, u + v(v − 1)/2: 0–1 → 0, 2–3 → 5, 1–2 → 2.
    const n = 4;
    const graph = fromEdgeList({
      n,
      sources: [0, 2, 1, 0],
      targets: [1, 3, 2, 3],
      weights: [1, 2, 3, 4],
      directed: false,
    });
    const { ledger, monitor, model } = edgesListed(graph);
    const before = ledger.held;
    ledger.noted = [];
    const pairs: number[][] = [];
    const essential: number[][] = [];
    const killers = unionFindPairs(
      model,
      0,
      ledger,
      {
        pair: (dim, birthKey, birthF, deathKey, deathF) =>
          pairs.push([dim, birthKey, birthF, deathKey, deathF]),
        essential: (dim, birthKey, birthF) => essential.push([dim, birthKey, birthF]),
      },
      monitor,
    );
    expect(pairs).toEqual([
      [0, 1, 0, 0, 1],
      [0, 3, 0, 5, 2],
      [0, 2, 0, 2, 3],
    ]);
    expect(essential).toEqual([[0, 0, 0]]);
    expect([0, 5, 2, 3].map((key) => killers.has(key))).toEqual([true, true, true, false]);
    // parent and oldest: two Int32Arrays of n (4 bytes an element), reserved under the stage's name and given
    // back; what stays held is the killers' map, 12 bytes a slot.
    expect(ledger.noted[0]).toEqual(["union–find over the vertices", 8 * n]);
    const mapBytes = ledger.noted.filter(([stage]) => stage === "recording the spanning-forest edges");
    expect(mapBytes.length).toBe(1);
    expect(ledger.held - before).toBe(mapBytes[0][1]);
    killers.dispose();
    expect(ledger.held).toBe(before);
  });

  it("sizes the killers' map for n − 1 edges up front, so the budget is asked once", () => {
    // A path on 40 vertices: 39 edges, each joining two components (worked by hand).
    const n = 40;
    const sources = Array.from({ length: n - 1 }, (_, i) => i);
    const graph = fromEdgeList({
      n,
      sources,
      targets: sources.map((i) => i + 1),
      weights: sources.map((i) => i + 1),
      directed: false,
    });
    const { ledger, monitor, model } = edgesListed(graph);
    ledger.noted = [];
    let pairs = 0;
    const killers = unionFindPairs(model, 0, ledger, { pair: () => pairs++, essential() {} }, monitor);
    expect(pairs).toBe(n - 1);
    expect(killers.size).toBe(n - 1);
    expect(ledger.noted.filter(([stage]) => stage === "recording the spanning-forest edges").length).toBe(1);
  });

  it("checks the clock at least once per 65,536 edges and far less often than once per edge", () => {
    // K_363 has 65,703 edges: past one round of 65,536. The contract of WorkMonitor (checks every few
    // thousand units of work, never per simplex) bounds the count from both sides; a stage that never
    // checked could not be stopped by a time limit.
    const graph = completeGraph(363);
    const { monitor, model } = edgesListed(graph);
    monitor.checks = [];
    unionFindPairs(model, 0, new ByteLedger(undefined), { pair() {}, essential() {} }, monitor);
    const edges = model.listSimplices(1).count;
    expect(edges).toBe(65_703); // C(363, 2)
    // One check when the stage begins, then at least one per 65,536 edges.
    expect(monitor.checks.length).toBeGreaterThanOrEqual(1 + Math.ceil(edges / 65_536));
    expect(monitor.checks.length).toBeLessThan(edges / 1000);
    expect(Math.max(...monitor.checks)).toBeLessThan(edges);
  });
});

import { fromEdgeList, fromGraphology } from "@cliquescape/core";
import { describe, expect, it } from "vitest";
import { toGraphology } from "./to-graphology.js";

describe("toGraphology", () => {
  const undirected = fromEdgeList({
    n: 4,
    sources: [0, 1, 2, 0],
    targets: [1, 2, 3, 2],
    weights: [0.5, 2, 1.5, 3],
    directed: false,
    labels: ["a", "b", "c", "d"],
  });

  it("keeps nodes, edges once each, and weights; fromGraphology gives the same graph back", () => {
    const g = toGraphology(undirected);
    expect(g.type).toBe("undirected");
    expect(g.nodes()).toEqual(["a", "b", "c", "d"]);
    expect(g.size).toBe(4);
    expect(g.getEdgeAttribute(g.edge("a", "c"), "weight")).toBe(3);
    const back = fromGraphology(g);
    expect(back.labels).toEqual(undirected.labels);
    expect(Array.from(back.offsets)).toEqual(Array.from(undirected.offsets));
    expect(Array.from(back.targets)).toEqual(Array.from(undirected.targets));
    expect(Array.from(back.weights)).toEqual(Array.from(undirected.weights));
  });

  it("keeps arc directions, reciprocal arcs with their own weights", () => {
    const directed = fromEdgeList({
      n: 3,
      sources: [0, 1, 2],
      targets: [1, 0, 0],
      weights: [1, 4, 2],
      directed: true,
    });
    const g = toGraphology(directed);
    expect(g.type).toBe("directed");
    expect(g.nodes()).toEqual(["0", "1", "2"]);
    expect(g.size).toBe(3);
    expect(g.getEdgeAttribute(g.edge("1", "0"), "weight")).toBe(4);
    expect(g.hasEdge("0", "2")).toBe(false);
    expect(Array.from(fromGraphology(g).weights)).toEqual(Array.from(directed.weights));
  });

  it("uses indices as keys when asked, and refuses repeated labels as keys", () => {
    expect(toGraphology(undirected, { keys: "index" }).nodes()).toEqual(["0", "1", "2", "3"]);
    const repeated = { ...undirected, labels: ["a", "b", "a", "d"] };
    expect(() => toGraphology(repeated)).toThrow(/repeats/);
    expect(toGraphology(repeated, { keys: "index" }).order).toBe(4);
  });
});

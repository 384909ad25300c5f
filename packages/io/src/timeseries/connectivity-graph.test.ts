import { connectivityMatrix, type TimeSeries } from "@cliquescape/core";
import { describe, expect, it } from "vitest";
import { connectivityGraph } from "./connectivity-graph.js";

const series: TimeSeries = {
  channels: 4,
  timePoints: 6,
  // a, b rise together; c falls as they rise; d is constant.
  values: Float64Array.from([1, 2, 3, 4, 5, 7, 2, 3, 5, 5, 6, 8, 9, 7, 6, 4, 2, 1, 3, 3, 3, 3, 3, 3]),
  labels: ["a", "b", "c", "d"],
};

const edges = (g: ReturnType<typeof connectivityGraph>["graph"]) => {
  const out: [string, string, number][] = [];
  for (let u = 0; u < g.n; u++) {
    for (let e = g.offsets[u]; e < g.offsets[u + 1]; e++)
      out.push([g.labels![u], g.labels![g.targets[e]], g.weights[e]]);
  }
  return out;
};

describe("connectivityGraph", () => {
  const c = connectivityMatrix(series, { measure: "pearson", badChannels: "isolate" });

  it("isolated channels are nodes without edges; the labels are the channel names", () => {
    const { graph } = connectivityGraph(c, "r.csv", "pearson", { negative: "abs" });
    expect([graph.n, graph.directed, graph.labels]).toEqual([4, false, ["a", "b", "c", "d"]]);
    expect(edges(graph).some(([u, v]) => u === "d" || v === "d")).toBe(false);
    expect(edges(graph).length).toBe(6);
  });

  it("negative values follow the negative-weight policy; refused, the message names both channels", () => {
    expect(
      edges(connectivityGraph(c, "r.csv", "pearson", { negative: "drop" }).graph).map(([u, v]) => u + v),
    ).toEqual(["ab", "ba"]);
    expect(() => connectivityGraph(c, "r.csv", "pearson", {})).toThrow(
      /^r\.csv: pearson between channel 0 \(a\) and channel 2 \(c\): negative weight -0\.9\d+/,
    );
  });

  it("a directed measure gives arcs; read as undirected it needs a symmetrize policy", () => {
    const lagged = connectivityMatrix(series, { measure: "lagged", maxLag: 1, badChannels: "isolate" });
    const { graph } = connectivityGraph(lagged, "r.csv", "lagged", { negative: "keep" });
    expect(graph.directed).toBe(true);
    expect(edges(graph).length).toBe(6);
    expect(() => connectivityGraph(lagged, "r.csv", "lagged", { directed: false, negative: "keep" })).toThrow(
      /lagged between channel \d \([abc]\) and channel \d \([abc]\): matrix is not symmetric/,
    );
    const merged = connectivityGraph(lagged, "r.csv", "lagged", {
      directed: false,
      negative: "keep",
      symmetrize: "max",
    });
    expect(merged.graph.directed).toBe(false);
  });
});

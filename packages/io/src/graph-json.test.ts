import { fromDenseMatrix } from "@cliquescape/core";
import { describe, expect, it } from "vitest";
import { graphFromJson, graphToJson } from "./graph-json.js";

describe("graph JSON", () => {
  it("round-trips an undirected graph with labels and coordinates, each edge once", () => {
    const graph = fromDenseMatrix(3, [0, 0.5, NaN, 0.5, 0, -0.25, NaN, -0.25, 0], {
      directed: false,
      negative: "keep",
      labels: ["a", "b", "c"],
    });
    const json = graphToJson(graph, { dims: 2, values: Float64Array.from([0, 0, 1, 0, 1, 1]) });
    expect(json.sources).toEqual([0, 1]);
    expect(json.targets).toEqual([1, 2]);
    const back = graphFromJson(JSON.parse(JSON.stringify(json)), "g.json");
    expect(back.graph).toEqual(graph);
    expect(Array.from(back.coordinates!.values)).toEqual([0, 0, 1, 0, 1, 1]);
  });

  it("keeps both arcs of a reciprocal directed pair", () => {
    const graph = fromDenseMatrix(2, [0, 1, 2, 0], { directed: true });
    const json = graphToJson(graph);
    expect(json.weights).toEqual([1, 2]);
    expect(graphFromJson(json, "g.json").graph).toEqual(graph);
  });

  it("refuses a document of another kind, naming the source", () => {
    expect(() => graphFromJson({ n: 2 }, "run/x.json")).toThrow(
      'run/x.json: not a cliquescape graph document: no "format": "cliquescape-graph/1"',
    );
  });
});

import { describe, expect, it } from "vitest";
import { binomial } from "../../../../test/support/combinatorics.js";
import {
  completeGraph,
  octahedron,
  randomDigraph,
  randomGraph,
  transitiveTournament,
} from "../../../../test/support/known-graphs.js";
import { seededRandom } from "../../../../test/support/random.js";
import { countSimplices } from "../count/count-simplices.js";
import { nodeEdgeFeatures } from "./node-edge-features.js";
import { weightedSquare } from "./weighted-square.fixture.js";

/** Column `name` of a row-major table with the given column names. */
function column(table: Float32Array, names: string[], name: string): number[] {
  const j = names.indexOf(name);
  if (j < 0) throw new Error(`no column ${name}`);
  const rows = table.length / names.length;
  return Array.from({ length: rows }, (_, i) => table[i * names.length + j]);
}

describe("nodeEdgeFeatures", () => {
  it("describes the octahedron: every vertex in 4 edges and 4 triangles, every edge in 2 triangles", () => {
    // K_{2,2,2}: 4-regular; its clique complex is a triangulated 2-sphere, where each vertex lies in 4 of the
    // 8 faces and each edge in exactly 2 (A. Hatcher, Algebraic Topology, 2002: a closed surface).
    const f = nodeEdgeFeatures(octahedron(), { topDim: 3 });
    expect(f.nodeFeatureNames).toEqual([
      "degree",
      "strength",
      "simplices_d1",
      "simplices_d2",
      "simplices_d3",
    ]);
    expect(f.edgeFeatureNames).toEqual(["weight", "simplices_d2", "simplices_d3"]);
    expect(f.x).toBeInstanceOf(Float32Array);
    expect(f.x.length).toBe(6 * 5);
    for (const name of ["degree", "strength", "simplices_d1", "simplices_d2"]) {
      expect(column(f.x, f.nodeFeatureNames, name)).toEqual(new Array(6).fill(4));
    }
    expect(column(f.x, f.nodeFeatureNames, "simplices_d3")).toEqual(new Array(6).fill(0));
    // 12 undirected edges, each listed both ways.
    expect(f.edgeIndex.length).toBe(2 * 24);
    expect(column(f.edgeAttr, f.edgeFeatureNames, "simplices_d2")).toEqual(new Array(24).fill(2));
    expect(f.truncated).toBe(false);
  });

  it("lists undirected edges both ways in edge_index, with matching attributes", () => {
    const f = nodeEdgeFeatures(randomGraph(12, 0.5, seededRandom(3), { weighted: true }), { topDim: 3 });
    const E = f.edgeIndex.length / 2;
    const key = (e: number) => `${f.edgeIndex[e]}-${f.edgeIndex[E + e]}`;
    const attrs = new Map<string, string>();
    for (let e = 0; e < E; e++) attrs.set(key(e), Array.from(f.edgeAttr.subarray(e * 3, e * 3 + 3)).join());
    for (let e = 0; e < E; e++) {
      const reverse = `${f.edgeIndex[E + e]}-${f.edgeIndex[e]}`;
      expect(attrs.get(reverse)).toBe(attrs.get(key(e)));
    }
  });

  it("counts edges and triangles of K_n per node and per edge in closed form (common practice)", () => {
    // In K_n a vertex lies in C(n−1, k) k-simplices and an edge in C(n−2, k−1) k-simplices.
    const n = 6;
    const f = nodeEdgeFeatures(completeGraph(n), { topDim: 4 });
    for (let k = 1; k <= 4; k++) {
      expect(column(f.x, f.nodeFeatureNames, `simplices_d${k}`)).toEqual(
        new Array(n).fill(binomial(n - 1, k)),
      );
    }
    for (let k = 2; k <= 4; k++) {
      expect(column(f.edgeAttr, f.edgeFeatureNames, `simplices_d${k}`)).toEqual(
        new Array(n * (n - 1)).fill(binomial(n - 2, k - 1)),
      );
    }
    expect(f.truncated).toBe(true); // K_6 has a 5-simplex
  });

  it("sums node participation to (k+1)·c_k and edge participation to C(k+1, 2)·c_k (common practice)", () => {
    const random = seededRandom(11);
    for (const graph of [
      randomGraph(15, 0.6, random, { weighted: true }),
      randomDigraph(10, 0.5, random, { weighted: true }),
    ]) {
      const topDim = 3;
      const f = nodeEdgeFeatures(graph, { topDim, threshold: 0.7, semantics: "distance" });
      const { counts } = countSimplices(graph, { threshold: 0.7, semantics: "distance", maxDim: topDim });
      for (let k = 1; k <= topDim; k++) {
        const c = counts[k] ?? 0;
        const nodeSum = column(f.x, f.nodeFeatureNames, `simplices_d${k}`).reduce((a, b) => a + b, 0);
        expect(nodeSum).toBe((k + 1) * c);
        if (graph.directed) {
          // Every directed simplex has one source and one sink.
          expect(
            column(f.x, f.nodeFeatureNames, `simplices_d${k}_as_source`).reduce((a, b) => a + b, 0),
          ).toBe(c);
          expect(column(f.x, f.nodeFeatureNames, `simplices_d${k}_as_sink`).reduce((a, b) => a + b, 0)).toBe(
            c,
          );
        }
        if (k >= 2) {
          // An undirected edge is listed twice, so its simplices are counted twice.
          const listed = graph.directed ? 1 : 2;
          const edgeSum = column(f.edgeAttr, f.edgeFeatureNames, `simplices_d${k}`).reduce(
            (a, b) => a + b,
            0,
          );
          expect(edgeSum).toBe(listed * binomial(k + 1, 2) * c);
        }
      }
    }
  });

  it("keeps only the edges present at the threshold, for degrees, strengths and edge_index", () => {
    // Square 0-1-2-3 with distances 1, 2, 3, 4 and diagonal 0-2 at 5; at threshold 3 the path 0-1-2-3 is left.
    const square = weightedSquare();
    const f = nodeEdgeFeatures(square, { topDim: 2, threshold: 3, semantics: "distance" });
    expect(column(f.x, f.nodeFeatureNames, "degree")).toEqual([1, 2, 2, 1]);
    expect(column(f.x, f.nodeFeatureNames, "strength")).toEqual([1, 3, 5, 3]);
    expect(Array.from(f.edgeIndex)).toEqual([0, 1, 1, 2, 2, 3, 1, 0, 2, 1, 3, 2]);
    expect(column(f.edgeAttr, f.edgeFeatureNames, "weight")).toEqual([1, 1, 2, 2, 3, 3]);
    // Similarity reading of the same weights at 3 keeps 2-3, 3-0, 0-2: one triangle.
    const s = nodeEdgeFeatures(square, { topDim: 2, threshold: 3, semantics: "similarity" });
    expect(column(s.x, s.nodeFeatureNames, "degree")).toEqual([2, 0, 2, 2]);
    expect(column(s.x, s.nodeFeatureNames, "simplices_d2")).toEqual([1, 0, 1, 1]);
    expect(column(s.edgeAttr, s.edgeFeatureNames, "simplices_d2")).toEqual([1, 1, 1, 1, 1, 1]);
    expect(() => nodeEdgeFeatures(square, { topDim: 2, threshold: 3 })).toThrow(TypeError);
    expect(() => nodeEdgeFeatures(square, { topDim: 0 })).toThrow(RangeError);
  });

  it("splits directed degrees and simplex roles: the transitive tournament in closed form", () => {
    // Transitive tournament on n nodes (arc u→v iff u < v): node i has in-degree i, out-degree n−1−i, starts
    // C(n−1−i, k) k-simplices and ends C(i, k) of them, and lies in C(n−1, k) (common practice).
    const n = 5;
    const f = nodeEdgeFeatures(transitiveTournament(n), { topDim: 3 });
    expect(f.nodeFeatureNames).toEqual([
      "in_degree",
      "out_degree",
      "in_strength",
      "out_strength",
      "simplices_d1",
      "simplices_d2",
      "simplices_d3",
      "simplices_d1_as_source",
      "simplices_d2_as_source",
      "simplices_d3_as_source",
      "simplices_d1_as_sink",
      "simplices_d2_as_sink",
      "simplices_d3_as_sink",
    ]);
    const nodes = [0, 1, 2, 3, 4];
    expect(column(f.x, f.nodeFeatureNames, "in_degree")).toEqual(nodes);
    expect(column(f.x, f.nodeFeatureNames, "out_strength")).toEqual(nodes.map((i) => n - 1 - i));
    for (let k = 1; k <= 3; k++) {
      expect(column(f.x, f.nodeFeatureNames, `simplices_d${k}`)).toEqual(nodes.map(() => binomial(n - 1, k)));
      expect(column(f.x, f.nodeFeatureNames, `simplices_d${k}_as_source`)).toEqual(
        nodes.map((i) => binomial(n - 1 - i, k)),
      );
      expect(column(f.x, f.nodeFeatureNames, `simplices_d${k}_as_sink`)).toEqual(
        nodes.map((i) => binomial(i, k)),
      );
    }
    // 10 arcs, each once; arc u→v lies in C(n−2, k−1) k-simplices.
    expect(f.edgeIndex.length).toBe(20);
    expect(column(f.edgeAttr, f.edgeFeatureNames, "simplices_d2")).toEqual(
      new Array(10).fill(binomial(3, 1)),
    );
  });

  it("takes topDim 1 (edges only), refuses less, and wants semantics with a threshold", () => {
    const square = weightedSquare();
    const f = nodeEdgeFeatures(square, { topDim: 1 });
    expect(f.nodeFeatureNames).toEqual(["degree", "strength", "simplices_d1"]);
    expect(column(f.x, f.nodeFeatureNames, "simplices_d1")).toEqual([3, 2, 3, 2]);
    for (const topDim of [0, 1.5])
      expect(() => nodeEdgeFeatures(square, { topDim })).toThrow(
        `topDim must be an integer ≥ 1, got ${topDim}`,
      );
    expect(() => nodeEdgeFeatures(square, { topDim: 2, threshold: 3 })).toThrow(
      "a threshold needs semantics: 'distance' or 'similarity'",
    );
  });
});

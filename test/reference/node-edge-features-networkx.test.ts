/**
 * Degrees and strengths of nodeEdgeFeatures (packages/core/src/features/node-edge-features.ts) against
 * networkx (Debian's python3-networkx), by test/support/python/node_strengths.py: Graph.degree and
 * Graph.degree(weight="weight") for undirected graphs, DiGraph.in_degree / out_degree with and without
 * weight="weight" for directed ones, on networkx G(n, p) graphs (weights drawn there), with all edges and at
 * a threshold. The node table is float32, so strengths are compared to 5 decimals.
 */
import { fromEdgeList, nodeEdgeFeatures, type WeightSemantics } from "@cliquescape/core";
import { describe, expect, it } from "vitest";
import { missingPythonModules, runPythonScript } from "../support/python.js";

interface Reference {
  n: number;
  edges: [number, number, number][];
  [column: string]: unknown;
}

type Case = {
  name: string;
  spec: Record<string, unknown>;
  threshold?: { value: number; semantics: WeightSemantics };
};

const missing = missingPythonModules(["networkx"]);

const CASES: Case[] = [
  { name: "G(20, 0.3), all edges", spec: { graph: "gnp", n: 20, p: 0.3, seed: 31, directed: false } },
  {
    name: "directed G(15, 0.3), all arcs",
    spec: { graph: "gnp", n: 15, p: 0.3, seed: 32, directed: true },
  },
  {
    name: "directed G(14, 0.4) at weight ≤ 0.55",
    spec: { graph: "gnp", n: 14, p: 0.4, seed: 33, directed: true },
    threshold: { value: 0.55, semantics: "distance" },
  },
  {
    name: "G(16, 0.4) at weight ≥ 0.4",
    spec: { graph: "gnp", n: 16, p: 0.4, seed: 34, directed: false },
    threshold: { value: 0.4, semantics: "similarity" },
  },
];

describe.skipIf(missing).each(CASES)(
  `node degrees and strengths agree with networkx: $name${missing ? ` (skipped: ${missing})` : ""}`,
  ({ spec, threshold }) => {
    it("every node, every column", () => {
      const reference = runPythonScript<Reference>("node_strengths.py", {
        ...spec,
        ...(threshold ? { threshold: threshold.value, semantics: threshold.semantics } : {}),
      });
      const graph = fromEdgeList({
        n: reference.n,
        directed: spec.directed as boolean,
        sources: reference.edges.map((e) => e[0]),
        targets: reference.edges.map((e) => e[1]),
        weights: reference.edges.map((e) => e[2]),
      });
      const f = nodeEdgeFeatures(graph, {
        topDim: 1,
        ...(threshold ? { threshold: threshold.value, semantics: threshold.semantics } : {}),
      });
      const columns = graph.directed
        ? ["in_degree", "out_degree", "in_strength", "out_strength"]
        : ["degree", "strength"];
      const F = f.nodeFeatureNames.length;
      for (const name of columns) {
        const j = f.nodeFeatureNames.indexOf(name);
        expect(j, name).toBeGreaterThanOrEqual(0);
        const expected = reference[name] as number[];
        expect(expected).toHaveLength(graph.n);
        // The sample is not degenerate: nodes differ in this column.
        expect(new Set(expected).size, name).toBeGreaterThan(2);
        for (let v = 0; v < graph.n; v++)
          expect(f.x[v * F + j], `${name} of node ${v}`).toBeCloseTo(expected[v], 5);
      }
    });
  },
);

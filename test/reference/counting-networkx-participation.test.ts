/**
 * Per-node participation (and, directed, as source and sink) and per-edge participation checked against
 * every simplex listed from networkx.enumerate_all_cliques (Debian's python3-networkx), by
 * test/support/python/participation.py: on Zachary's karate club (W. W. Zachary, J. Anthropological
 * Research 33(4), 1977, as networkx.karate_club_graph() ships it) and on networkx random graphs, with all
 * edges and at a threshold.
 */
import { countSimplices, fromEdgeList, type WeightSemantics } from "@cliquescape/core";
import { describe, expect, it } from "vitest";
import { missingPythonModules, runPythonScript } from "../support/python.js";

interface Reference {
  n: number;
  directed: boolean;
  graphEdges: [number, number, number][];
  member: number[][];
  source: number[][];
  sink: number[][];
  edges: [number, number, number[]][];
}

type Case = {
  name: string;
  spec: Record<string, unknown>;
  threshold?: { value: number; semantics: WeightSemantics };
};

const missing = missingPythonModules(["networkx"]);

const CASES: Case[] = [
  { name: "karate club, all edges", spec: { graph: "karate" } },
  {
    name: "karate club at weight ≥ 3",
    spec: { graph: "karate" },
    threshold: { value: 3, semantics: "similarity" },
  },
  {
    name: "G(30, 0.3) at weight ≤ 0.63",
    spec: { graph: "gnp", n: 30, p: 0.3, seed: 11, directed: false },
    threshold: { value: 0.63, semantics: "distance" },
  },
  {
    name: "directed G(16, 0.35), all arcs",
    spec: { graph: "gnp", n: 16, p: 0.35, seed: 21, directed: true },
  },
  {
    name: "directed G(12, 0.7) at weight ≥ 0.37",
    spec: { graph: "gnp", n: 12, p: 0.7, seed: 22, directed: true },
    threshold: { value: 0.37, semantics: "similarity" },
  },
];

/** rows[k][i], or 0 past the end: the two sides may allocate different top dimensions. */
const at = (rows: ArrayLike<ArrayLike<number>> | undefined, k: number, i: number) =>
  rows && k < rows.length ? rows[k][i] : 0;

describe.skipIf(missing).each(CASES)(
  `participation agrees with networkx: $name${missing ? ` (skipped: ${missing})` : ""}`,
  ({ spec, threshold }) => {
    it("per node and per edge, in every dimension", () => {
      const reference = runPythonScript<Reference>("participation.py", {
        ...spec,
        ...(threshold ? { threshold: threshold.value, semantics: threshold.semantics } : {}),
      });
      const graph = fromEdgeList({
        n: reference.n,
        directed: reference.directed,
        sources: reference.graphEdges.map((e) => e[0]),
        targets: reference.graphEdges.map((e) => e[1]),
        weights: reference.graphEdges.map((e) => e[2]),
      });
      const result = countSimplices(graph, {
        participation: true,
        edgeParticipation: true,
        ...(threshold ? { threshold: threshold.value, semantics: threshold.semantics } : {}),
      });
      const top = Math.max(reference.member.length, result.counts.length) - 1;
      expect(reference.member.length).toBeGreaterThanOrEqual(3); // reaches 2-simplices at least

      const participation = result.participation!;
      for (let k = 0; k <= top; k++) {
        for (let v = 0; v < graph.n; v++) {
          expect(at(participation.member, k, v), `member[${k}][${v}]`).toBe(at(reference.member, k, v));
          if (graph.directed) {
            expect(at(participation.source, k, v), `source[${k}][${v}]`).toBe(at(reference.source, k, v));
            expect(at(participation.sink, k, v), `sink[${k}][${v}]`).toBe(at(reference.sink, k, v));
          }
        }
      }
      if (!graph.directed) expect(participation.source).toBeUndefined();

      const expectedOfEdge = new Map(reference.edges.map(([u, v, counts]) => [`${u}-${v}`, counts]));
      for (let u = 0; u < graph.n; u++) {
        for (let s = graph.offsets[u]; s < graph.offsets[u + 1]; s++) {
          const v = graph.targets[s];
          const key = graph.directed || u < v ? `${u}-${v}` : `${v}-${u}`;
          const expected = expectedOfEdge.get(key); // absent: the edge is not in at this threshold
          for (let k = 0; k <= top; k++) {
            expect(at(result.edgeParticipation, k, s), `edge ${u}→${v}, dimension ${k}`).toBe(
              expected?.[k] ?? 0,
            );
          }
        }
      }
    });
  },
);

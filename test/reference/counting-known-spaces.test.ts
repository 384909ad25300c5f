/**
 * Euler characteristic from the simplex counts of flag complexes that triangulate known surfaces:
 * χ(S²) = 2 and χ(torus) = 0 (A. Hatcher, Algebraic Topology, 2002, §2.2). The fixtures are first shown
 * to be what they claim, independently of the core: networkx (Debian's python3-networkx) lists the graph's
 * cliques, and test/support/surfaces.ts checks the faces form a connected closed orientable surface.
 */
import { countSimplices, evenGrid, sweepSimplexCounts } from "@cliquescape/core";
import { describe, expect, it } from "vitest";
import { edgesOf, significant } from "../support/graph-ops.js";
import { octahedronSurface, type TriangulatedSurface, torusGrid4x4 } from "../support/known-graphs.js";
import { missingPythonModules, runPythonScript } from "../support/python.js";
import { describeSurface, type Face, projectivePlane6 } from "../support/surfaces.js";

const missing = missingPythonModules(["networkx"]);

const sortedTriples = (faces: readonly Face[]) =>
  faces.map((f) => [...f].sort((a, b) => a - b)).sort(compareTriples);
function compareTriples(a: number[], b: number[]): number {
  return a[0] - b[0] || a[1] - b[1] || a[2] - b[2];
}

const SPACES: { name: string; surface: () => TriangulatedSurface; counts: number[]; euler: number }[] = [
  // Octahedron boundary: 6 vertices, 12 edges, 8 faces (common practice); a 2-sphere, χ = 2 (Hatcher 2002).
  { name: "octahedron K_{2,2,2} (2-sphere)", surface: octahedronSurface, counts: [6, 12, 8], euler: 2 },
  // 4×4 grid torus: 16 vertices, 3·16 edges, 2·16 triangles (by construction); a torus, χ = 0 (Hatcher 2002).
  { name: "4×4 grid torus", surface: torusGrid4x4, counts: [16, 48, 32], euler: 0 },
];

describe.each(SPACES)("$name", ({ surface, counts, euler }) => {
  const { graph, faces } = surface();

  it("its faces form a connected closed orientable surface with the stated χ", () => {
    const report = describeSurface(graph.n, faces);
    expect(report).toEqual({
      vertices: counts[0],
      edges: counts[1],
      faces: counts[2],
      everyEdgeInTwoFaces: true,
      vertexLinksAreCycles: true,
      connected: true,
      orientable: true,
      euler,
    });
    // The graph is exactly the 1-skeleton of the faces.
    const faceEdges = new Set(
      faces.flatMap(([a, b, c]) =>
        [
          [a, b],
          [b, c],
          [a, c],
        ].map(([x, y]) => `${Math.min(x, y)}-${Math.max(x, y)}`),
      ),
    );
    const graphEdges = edgesOf(graph);
    expect(new Set(graphEdges.sources.map((u, e) => `${u}-${graphEdges.targets[e]}`))).toEqual(faceEdges);
  });

  it("every triangle of the graph is a face and it has no K4 (by trying every triple and quadruple)", () => {
    const adjacent = (u: number, v: number) => {
      for (let s = graph.offsets[u]; s < graph.offsets[u + 1]; s++) if (graph.targets[s] === v) return true;
      return false;
    };
    const triangles: number[][] = [];
    let k4 = 0;
    for (let a = 0; a < graph.n; a++) {
      for (let b = a + 1; b < graph.n; b++) {
        for (let c = b + 1; c < graph.n; c++) {
          if (!(adjacent(a, b) && adjacent(a, c) && adjacent(b, c))) continue;
          triangles.push([a, b, c]);
          for (let d = c + 1; d < graph.n; d++) if (adjacent(a, d) && adjacent(b, d) && adjacent(c, d)) k4++;
        }
      }
    }
    expect(triangles).toEqual(sortedTriples(faces));
    expect(k4).toBe(0);
  });

  it.skipIf(missing)(
    `it is a flag complex: networkx finds exactly the faces as triangles and no K4${missing ? ` (skipped: ${missing})` : ""}`,
    () => {
      const edges = edgesOf(graph);
      const reference = runPythonScript<{ all: number[]; cliques: number[][] }>("clique_counts.py", {
        graph: "edges",
        n: graph.n,
        directed: false,
        edges: edges.sources.map((u, e) => [u, edges.targets[e], edges.weights[e]]),
        listSize: 3,
      });
      // networkx.enumerate_all_cliques: the clique complex has exactly these simplices.
      expect(reference.all).toEqual(counts);
      expect(reference.cliques.sort(compareTriples)).toEqual(sortedTriples(faces));
    },
  );

  it(`the core counts its flag complex and gets χ = ${euler}`, () => {
    const result = countSimplices(graph);
    expect(significant(result.counts)).toEqual(counts);
    expect(result.euler).toBe(euler);
  });

  it("the sweep reaches the same χ once every edge is in", () => {
    const sweep = sweepSimplexCounts(graph, evenGrid(0, 1, 3, "distance"));
    // Before any edge (threshold 0 < weight 1) the complex is the n isolated vertices: χ = n.
    expect(Array.from(sweep.euler)).toEqual([counts[0], counts[0], euler]);
  });
});

describe("the surface checks can fail", () => {
  it("recognise the 6-vertex projective plane as closed, non-orientable, χ = 1", () => {
    // The 6-vertex RP² (test/support/surfaces.ts, recalled from memory); checked here to be what it claims.
    const faces = projectivePlane6;
    const report = describeSurface(6, faces);
    expect(report).toMatchObject({
      everyEdgeInTwoFaces: true,
      vertexLinksAreCycles: true,
      connected: true,
      euler: 1,
    });
    expect(report.orientable).toBe(false);
  });

  it("reject a cone (a disc: boundary edges lie in one face)", () => {
    const report = describeSurface(5, [
      [0, 1, 2],
      [0, 2, 3],
      [0, 3, 4],
    ]);
    expect(report.everyEdgeInTwoFaces).toBe(false);
    expect(report.vertexLinksAreCycles).toBe(false);
  });
});

/**
 * Betti numbers of spaces whose homology is in the textbooks, given as clique complexes, computed two
 * independent ways: directly by boundary ranks (bettiAt) and from the persistence barcode of a filtration
 * with random distinct weights, read at the threshold where every edge is present.
 */
import {
  bettiAt,
  bettiFromBarcode,
  computeBarcode,
  countSimplices,
  fromEdgeList,
  type WeightedGraph,
} from "@cliquescape/core";
import { describe, expect, it } from "vitest";
import { octahedronSurface, torusGrid4x4 } from "../support/known-graphs.js";
import { seededRandom } from "../support/random.js";
import { describeSurface, type Face, projectivePlane6 } from "../support/surfaces.js";

/** The graph with fresh random weights in [1, 2) on its edges (same edges). */
function reweighted(graph: WeightedGraph, seed: number): WeightedGraph {
  const random = seededRandom(seed);
  const sources: number[] = [];
  const targets: number[] = [];
  const weights: number[] = [];
  for (let u = 0; u < graph.n; u++) {
    for (let s = graph.offsets[u]; s < graph.offsets[u + 1]; s++) {
      const v = graph.targets[s];
      if (v < u) continue;
      sources.push(u);
      targets.push(v);
      weights.push(1 + random());
    }
  }
  return fromEdgeList({ n: graph.n, sources, targets, weights, directed: false });
}

function graphOfFaces(n: number, faces: readonly Face[]): WeightedGraph {
  const pairs = new Set<number>();
  for (const [a, b, c] of faces) {
    for (const [x, y] of [
      [a, b],
      [b, c],
      [a, c],
    ]) {
      pairs.add(Math.min(x, y) * n + Math.max(x, y));
    }
  }
  const list = [...pairs];
  return fromEdgeList({
    n,
    sources: list.map((k) => Math.floor(k / n)),
    targets: list.map((k) => k % n),
    weights: list.map(() => 1),
    directed: false,
  });
}

/** β_0 … β_maxDim both ways, for one prime. */
function bettiBothWays(graph: WeightedGraph, maxDim: number, prime: number, seed: number) {
  const weighted = reweighted(graph, seed);
  const direct = bettiAt(weighted, { threshold: 2, semantics: "distance", maxDim, prime });
  const barcode = computeBarcode(weighted, { semantics: "distance", maxDim, prime });
  const fromBars = bettiFromBarcode(barcode, 2);
  // Similarity weights walk the same edges in the opposite order; the final complex is the same.
  const barcodeSimilar = computeBarcode(weighted, { semantics: "similarity", maxDim, prime });
  const fromBarsSimilar = bettiFromBarcode(barcodeSimilar, 1);
  return { direct, fromBars, fromBarsSimilar };
}

function expectBetti(graph: WeightedGraph, maxDim: number, prime: number, expected: number[]) {
  for (const seed of [1, 2]) {
    const { direct, fromBars, fromBarsSimilar } = bettiBothWays(graph, maxDim, prime, seed);
    expect(direct).toEqual(expected);
    expect(fromBars).toEqual(expected);
    expect(fromBarsSimilar).toEqual(expected);
  }
}

/** The clique complex of the graph is exactly the surface: as many cliques as faces, none larger. */
function expectCliquesAreFaces(graph: WeightedGraph, faces: readonly Face[]) {
  const { counts } = countSimplices(graph);
  expect(counts[2]).toBe(faces.length);
  expect(counts[3] ?? 0).toBe(0);
}

/**
 * 4×4 grid triangulation of the Klein bottle: the square [0,4]² with (4, j) ≡ (0, j) and (i, 4) ≡ (−i, 0)
 * (the top edge glued to the bottom reversed), cut into 32 triangles along the (1,1) diagonals.
 * A. Hatcher, Algebraic Topology, 2002, §2.1 (the Klein bottle as a square with sides identified).
 */
function kleinBottle4x4(): Face[] {
  const id = (i: number, j: number): number => {
    if (j === 4) return id((4 - (i % 4)) % 4, 0);
    return (i % 4) * 4 + j;
  };
  const faces: Face[] = [];
  for (let i = 0; i < 4; i++) {
    for (let j = 0; j < 4; j++) {
      faces.push([id(i, j), id(i + 1, j), id(i + 1, j + 1)]);
      faces.push([id(i, j), id(i + 1, j + 1), id(i, j + 1)]);
    }
  }
  return faces;
}

/**
 * The 6-vertex real projective plane (the antipodal quotient of the icosahedron; triangle list recalled
 * from memory and checked below to be a closed non-orientable surface with χ = 1, hence RP² by the
 * classification of surfaces), then its barycentric subdivision: vertices are the simplices, a triangle
 * per flag vertex ⊂ edge ⊂ face. A barycentric subdivision is a flag complex (common practice: it is the
 * order complex of the face poset), so it is the clique complex of its 1-skeleton.
 */
const rp2Faces = projectivePlane6;

function barycentricSubdivision(faces: readonly Face[]): { n: number; faces: Face[] } {
  const ids = new Map<string, number>();
  const id = (simplex: number[]) => {
    const key = [...simplex].sort((a, b) => a - b).join(",");
    if (!ids.has(key)) ids.set(key, ids.size);
    return ids.get(key)!;
  };
  const out: Face[] = [];
  for (const face of faces) {
    for (const v of face) {
      for (const w of face) {
        if (w === v) continue;
        out.push([id([v]), id([v, w]), id([...face])]);
      }
    }
  }
  return { n: ids.size, faces: out };
}

describe("textbook spaces as clique complexes (A. Hatcher, Algebraic Topology, 2002, §2.1–2.2)", () => {
  it("octahedron K_{2,2,2} is a 2-sphere: Betti (1, 0, 1) over Z/2 and Z/3", () => {
    const { graph } = octahedronSurface();
    expectBetti(graph, 2, 2, [1, 0, 1]);
    expectBetti(graph, 2, 3, [1, 0, 1]);
  });

  it("4×4 torus: Betti (1, 2, 1) over Z/2 and Z/3", () => {
    const { graph, faces } = torusGrid4x4();
    expectCliquesAreFaces(graph, faces);
    expectBetti(graph, 2, 2, [1, 2, 1]);
    expectBetti(graph, 2, 3, [1, 2, 1]);
  });

  it("4×4 Klein bottle: Betti (1, 2, 1) over Z/2 but (1, 1, 0) over Z/3 (H1 = Z ⊕ Z/2)", () => {
    const faces = kleinBottle4x4();
    const surface = describeSurface(16, faces);
    expect(surface).toMatchObject({ everyEdgeInTwoFaces: true, vertexLinksAreCycles: true, connected: true });
    expect(surface.orientable).toBe(false);
    expect(surface.euler).toBe(0);
    const graph = graphOfFaces(16, faces);
    expectCliquesAreFaces(graph, faces);
    expectBetti(graph, 2, 2, [1, 2, 1]);
    expectBetti(graph, 2, 3, [1, 1, 0]);
  });

  it("barycentric subdivision of the 6-vertex RP²: (1, 1, 1) over Z/2, (1, 0, 0) over Z/3 (H1 = Z/2)", () => {
    const rp2 = describeSurface(6, rp2Faces);
    expect(rp2).toMatchObject({ everyEdgeInTwoFaces: true, vertexLinksAreCycles: true, connected: true });
    expect(rp2.orientable).toBe(false);
    expect(rp2.euler).toBe(1);
    const { n, faces } = barycentricSubdivision(rp2Faces);
    expect(n).toBe(31);
    expect(faces.length).toBe(60);
    const graph = graphOfFaces(n, faces);
    expectCliquesAreFaces(graph, faces);
    expectBetti(graph, 2, 2, [1, 1, 1]);
    expectBetti(graph, 2, 3, [1, 0, 0]);
    expectBetti(graph, 2, 5, [1, 0, 0]);
  });
});

/**
 * Powers of cycles: C_n^r joins i and j when their cyclic distance is at most r. M. Adamaszek, "Clique
 * complexes and graph powers", Israel J. Math. 196 (2013), Thm. (statement recalled from memory): for
 * 0 < r < n/2, the clique complex is homotopy equivalent to S^{2k+1} when k/(2k+1) < r/n < (k+1)/(2k+3),
 * and to a wedge of n − 2r − 1 copies of S^{2k} when r/n = k/(2k+1). Spheres have no torsion, so the
 * Betti numbers are the same over every Z/p.
 */
function cyclePower(n: number, r: number): WeightedGraph {
  const sources: number[] = [];
  const targets: number[] = [];
  for (let u = 0; u < n; u++) {
    for (let v = u + 1; v < n; v++) {
      if (Math.min(v - u, n - (v - u)) <= r) {
        sources.push(u);
        targets.push(v);
      }
    }
  }
  return fromEdgeList({ n, sources, targets, weights: sources.map(() => 1), directed: false });
}

function adamaszekBetti(n: number, r: number, maxDim: number): number[] {
  const betti = new Array<number>(maxDim + 1).fill(0);
  betti[0] = 1;
  for (let k = 0; 2 * k + 1 <= n; k++) {
    // r/n = k/(2k+1)  ⇔  r(2k+1) = kn (exact integer comparisons).
    if (k > 0 && r * (2 * k + 1) === k * n) {
      if (2 * k <= maxDim) betti[2 * k] += n - 2 * r - 1;
      return betti;
    }
    if (r * (2 * k + 1) > k * n && r * (2 * k + 3) < (k + 1) * n) {
      if (2 * k + 1 <= maxDim) betti[2 * k + 1] += 1;
      return betti;
    }
  }
  throw new Error(`no case of the theorem for n=${n}, r=${r}`);
}

describe("powers of cycles (M. Adamaszek, Israel J. Math. 196, 2013)", () => {
  const cases: [number, number, string][] = [
    [7, 2, "S^1"],
    [6, 2, "S^2 (the octahedron)"],
    [9, 3, "S^2 ∨ S^2"],
    [12, 4, "three S^2"],
    [8, 3, "S^3"],
    [11, 4, "S^3"],
    [13, 5, "S^3"],
  ];
  for (const [n, r, space] of cases) {
    it(`C_${n}^${r} is ${space}`, () => {
      const expected = adamaszekBetti(n, r, 3);
      if (space === "S^3") expect(expected).toEqual([1, 0, 0, 1]);
      expectBetti(cyclePower(n, r), 3, 2, expected);
      expectBetti(cyclePower(n, r), 3, 3, expected);
    });
  }
});

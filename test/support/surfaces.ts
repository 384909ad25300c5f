/**
 * Combinatorial checks that a list of triangles is a closed surface, and which one. A finite 2-complex in
 * which every edge lies in exactly two triangles and the link of every vertex is a single cycle is a closed
 * surface; a connected closed surface is determined by orientability and Euler characteristic (the
 * classification of surfaces: W. S. Massey, A Basic Course in Algebraic Topology, 1991, ch. 1;
 * A. Hatcher, Algebraic Topology, 2002, §2.2 for χ).
 */

export type Face = readonly [number, number, number];

export interface SurfaceReport {
  vertices: number;
  edges: number;
  faces: number;
  everyEdgeInTwoFaces: boolean;
  vertexLinksAreCycles: boolean;
  connected: boolean;
  orientable: boolean;
  euler: number;
}

const edgeKey = (a: number, b: number) => (a < b ? `${a}-${b}` : `${b}-${a}`);

export function describeSurface(n: number, faces: readonly Face[]): SurfaceReport {
  const facesOfEdge = new Map<string, number[]>();
  faces.forEach((face, f) => {
    for (const [a, b] of facePairs(face)) {
      const key = edgeKey(a, b);
      facesOfEdge.set(key, [...(facesOfEdge.get(key) ?? []), f]);
    }
  });
  const everyEdgeInTwoFaces = [...facesOfEdge.values()].every((list) => list.length === 2);
  const vertexLinksAreCycles = Array.from({ length: n }, (_, v) => linkIsOneCycle(v, faces)).every(Boolean);
  const { connected, orientable } = orient(faces, facesOfEdge);
  const usedVertices = new Set(faces.flat()).size;
  return {
    vertices: usedVertices,
    edges: facesOfEdge.size,
    faces: faces.length,
    everyEdgeInTwoFaces,
    vertexLinksAreCycles,
    connected: connected && usedVertices === n,
    orientable,
    euler: usedVertices - facesOfEdge.size + faces.length,
  };
}

function facePairs([a, b, c]: Face): [number, number][] {
  return [
    [a, b],
    [b, c],
    [c, a],
  ];
}

/** The link of v (the edges opposite v in its faces) must form one cycle through all its neighbours. */
function linkIsOneCycle(v: number, faces: readonly Face[]): boolean {
  const link = faces.filter((f) => f.includes(v)).map((f) => f.filter((x) => x !== v));
  if (link.length < 3) return false;
  const neighbours = new Map<number, number[]>();
  for (const [a, b] of link) {
    neighbours.set(a, [...(neighbours.get(a) ?? []), b]);
    neighbours.set(b, [...(neighbours.get(b) ?? []), a]);
  }
  if ([...neighbours.values()].some((list) => list.length !== 2)) return false;
  // Walk the cycle from one vertex; it must come back after visiting every link vertex.
  const start = link[0][0];
  let previous = start;
  let current = link[0][1];
  let steps = 1;
  while (current !== start) {
    const [x, y] = neighbours.get(current)!;
    [previous, current] = [current, x === previous ? y : x];
    steps++;
  }
  return steps === neighbours.size;
}

/**
 * Orients faces by propagation across shared edges (a neighbour must run the shared edge the other way)
 * and reports whether this succeeds without contradiction, and whether it reached every face.
 */
function orient(faces: readonly Face[], facesOfEdge: Map<string, number[]>) {
  const oriented: (Face | undefined)[] = new Array(faces.length);
  if (faces.length === 0) return { connected: false, orientable: false };
  oriented[0] = faces[0];
  const queue = [0];
  let orientable = true;
  let reached = 1;
  while (queue.length > 0) {
    const f = queue.shift()!;
    for (const [a, b] of facePairs(oriented[f]!)) {
      for (const g of facesOfEdge.get(edgeKey(a, b)) ?? []) {
        if (g === f) continue;
        // g must contain the directed edge b→a; choose its orientation accordingly.
        const [x, y, z] = faces[g];
        const wanted: Face = runs(faces[g], b, a) ? [x, y, z] : [x, z, y];
        if (oriented[g] === undefined) {
          oriented[g] = wanted;
          reached++;
          queue.push(g);
        } else if (!runs(oriented[g]!, b, a)) {
          orientable = false;
        }
      }
    }
  }
  return { connected: reached === faces.length, orientable };
}

/** Whether the cyclic order of `face` contains the step from → to. */
function runs(face: Face, from: number, to: number): boolean {
  return facePairs(face).some(([a, b]) => a === from && b === to);
}

/**
 * The 6-vertex triangulation of the real projective plane (the antipodal quotient of the icosahedron).
 * Recalled from memory; the tests that use it first check it is a closed, non-orientable surface with
 * χ = 1, which is RP² by the classification of surfaces (W. S. Massey, A Basic Course in Algebraic
 * Topology, 1991).
 */
export const projectivePlane6: readonly Face[] = [
  [0, 1, 2],
  [0, 2, 3],
  [0, 3, 4],
  [0, 4, 5],
  [0, 5, 1],
  [1, 2, 4],
  [2, 3, 5],
  [3, 4, 1],
  [4, 5, 2],
  [5, 1, 3],
];

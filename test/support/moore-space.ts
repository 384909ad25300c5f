/**
 * A flag triangulation of the Moore space M(Z/q, 1): a disc whose boundary wraps q times around a circle
 * (the "pseudo-projective plane"; q = 2 is RP²). Its cellular chain complex is Z --q--> Z --0--> Z, so
 * H_1 = Z/q and H_2 = 0 with integer coefficients, and over Z/p: β_1 = β_2 = 1 when p divides q, else
 * β_1 = β_2 = 0 (A. Hatcher, Algebraic Topology, 2002, Example 2.40 (Moore spaces, cellular homology) and
 * §3.A (universal coefficients)).
 *
 * Triangulation (built here; the tests check it is a flag complex with χ = 1):
 * - the circle: vertices a_0 … a_{m−1} in a cycle, m ≥ 4 so that the cycle has no chord and bounds no
 *   triangle of the graph;
 * - the disc's outer ring: q·m boundary points b_i, glued to a_{i mod m};
 * - an inner ring c_0 … c_{qm−1} (a chordless cycle) and a centre z;
 * - triangles (a_i, a_{i+1}, c_i) and (a_{i+1}, c_{i+1}, c_i) between the rings, (c_i, c_{i+1}, z) in the
 *   middle, indices of a mod m and of c mod qm.
 * Vertices: a_j = j, c_i = m + i, z = m + qm. For q = 5, m = 4: 25 vertices, 84 edges, 60 triangles.
 */
export interface MooreSpace {
  n: number;
  triangles: [number, number, number][];
  edges: [number, number][];
}

export function mooreSpace(q: number, m = 4): MooreSpace {
  if (m < 4) throw new RangeError("the circle needs at least 4 vertices to stay chordless");
  const a = (j: number) => ((j % m) + m) % m;
  const c = (i: number) => m + (((i % (q * m)) + q * m) % (q * m));
  const z = m + q * m;
  const triangles: [number, number, number][] = [];
  for (let i = 0; i < q * m; i++) {
    triangles.push([a(i), a(i + 1), c(i)]);
    triangles.push([a(i + 1), c(i + 1), c(i)]);
    triangles.push([c(i), c(i + 1), z]);
  }
  const edgeSet = new Set<number>();
  const n = z + 1;
  for (const [x, y, w] of triangles) {
    for (const [u, v] of [
      [x, y],
      [y, w],
      [x, w],
    ])
      edgeSet.add(Math.min(u, v) * n + Math.max(u, v));
  }
  const edges = [...edgeSet].sort((s, t) => s - t).map((k): [number, number] => [Math.floor(k / n), k % n]);
  return {
    n,
    triangles: triangles.map((t) => [...t].sort((s, u) => s - u) as [number, number, number]),
    edges,
  };
}

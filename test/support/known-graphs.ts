/**
 * Graphs whose clique / flag complexes are known in closed form, and seeded random graphs, for tests
 * across the repository. Every builder returns a core `WeightedGraph`; weights default to 1.
 */
import { fromEdgeList, type WeightedGraph } from "@cliquescape/core";
import type { Random } from "./random.js";

/** Edges as parallel arrays, the shape `fromEdgeList` takes (undirected pairs given once). */
export interface EdgeList {
  n: number;
  directed: boolean;
  sources: number[];
  targets: number[];
  weights: number[];
}

export function graphOf(edges: EdgeList): WeightedGraph {
  return fromEdgeList(edges);
}

function emptyEdgeList(n: number, directed: boolean): EdgeList {
  return { n, directed, sources: [], targets: [], weights: [] };
}

function push(edges: EdgeList, u: number, v: number, w = 1): void {
  edges.sources.push(u);
  edges.targets.push(v);
  edges.weights.push(w);
}

/** The complete graph K_n (undirected). */
export function completeGraph(n: number): WeightedGraph {
  const edges = emptyEdgeList(n, false);
  for (let u = 0; u < n; u++) for (let v = u + 1; v < n; v++) push(edges, u, v);
  return graphOf(edges);
}

/** The transitive tournament on n vertices: an arc u→v exactly when u < v. */
export function transitiveTournament(n: number): WeightedGraph {
  const edges = emptyEdgeList(n, true);
  for (let u = 0; u < n; u++) for (let v = u + 1; v < n; v++) push(edges, u, v);
  return graphOf(edges);
}

/** The digraph on n vertices with these arcs [u, v] (u→v), every arc of weight 1. */
export function digraphOf(arcs: readonly (readonly number[])[], n: number): WeightedGraph {
  const edges = emptyEdgeList(n, true);
  for (const [u, v] of arcs) push(edges, u, v);
  return graphOf(edges);
}

/** The directed cycle 0→1→…→(n−1)→0. */
export function directedCycle(n: number): WeightedGraph {
  const edges = emptyEdgeList(n, true);
  for (let u = 0; u < n; u++) push(edges, u, (u + 1) % n);
  return graphOf(edges);
}

/** The symmetric digraph of an undirected graph: both arcs u→v and v→u for every edge, same weight. */
export function symmetricDigraph(graph: WeightedGraph): WeightedGraph {
  if (graph.directed) throw new Error("symmetricDigraph expects an undirected graph");
  const edges = emptyEdgeList(graph.n, true);
  for (let u = 0; u < graph.n; u++) {
    for (let s = graph.offsets[u]; s < graph.offsets[u + 1]; s++)
      push(edges, u, graph.targets[s], graph.weights[s]);
  }
  return graphOf(edges);
}

/**
 * The octahedron graph K_{2,2,2}: six vertices, each adjacent to all but its antipode (v and v+3).
 * Its clique complex is the boundary of the octahedron, a 2-sphere (A. Hatcher, Algebraic Topology, 2002).
 */
export function octahedron(): WeightedGraph {
  return octahedronSurface().graph;
}

/** The octahedron as a triangulated surface: its 8 faces pick one vertex from each antipodal pair. */
export function octahedronSurface(): TriangulatedSurface {
  const edges = emptyEdgeList(6, false);
  for (let u = 0; u < 6; u++) for (let v = u + 1; v < 6; v++) if (v !== u + 3) push(edges, u, v);
  const faces: [number, number, number][] = [];
  for (const a of [0, 3]) for (const b of [1, 4]) for (const c of [2, 5]) faces.push([a, b, c]);
  return { graph: graphOf(edges), faces };
}

/** A triangulated surface: its 1-skeleton graph and its oriented triangles. */
export interface TriangulatedSurface {
  graph: WeightedGraph;
  /** Each face as a vertex triple (orientation not implied). */
  faces: [number, number, number][];
}

/**
 * The 4×4 grid triangulation of the torus: vertex (i, j) ↦ 4i + j with indices mod 4; each square
 * (i, j)…(i+1, j+1) is cut along its diagonal into two triangles. 16 vertices, 48 edges, 32 triangles.
 * On a 4×4 grid no three steps from {±(1,0), ±(0,1), ±(1,1)} close a loop except around a face, so the
 * graph's triangles are exactly the faces and its clique complex is the torus (checked in
 * test/reference/counting-known-spaces.test.ts).
 */
export function torusGrid4x4(): TriangulatedSurface {
  const size = 4;
  const id = (i: number, j: number) => ((i + size) % size) * size + ((j + size) % size);
  const edges = emptyEdgeList(size * size, false);
  const faces: [number, number, number][] = [];
  for (let i = 0; i < size; i++) {
    for (let j = 0; j < size; j++) {
      const v = id(i, j);
      for (const [di, dj] of [
        [1, 0],
        [0, 1],
        [1, 1],
      ]) {
        push(edges, v, id(i + di, j + dj));
      }
      faces.push([v, id(i + 1, j), id(i + 1, j + 1)]);
      faces.push([v, id(i + 1, j + 1), id(i, j + 1)]);
    }
  }
  return { graph: graphOf(edges), faces };
}

/** Options for seeded random graphs: weights uniform in [0, 1), or a constant when not drawn. */
export interface RandomGraphOptions {
  weighted?: boolean;
}

/** Erdős–Rényi G(n, p): each of the n(n−1)/2 pairs is an edge independently with probability p. */
export function randomGraphEdges(
  n: number,
  p: number,
  random: Random,
  options: RandomGraphOptions = {},
): EdgeList {
  const edges = emptyEdgeList(n, false);
  for (let u = 0; u < n; u++) {
    for (let v = u + 1; v < n; v++) if (random() < p) push(edges, u, v, options.weighted ? random() : 1);
  }
  return edges;
}

/**
 * Directed Erdős–Rényi: each of the n(n−1) ordered pairs (u, v), u ≠ v, is an arc independently with
 * probability p, so a pair may be joined both ways.
 */
export function randomDigraphEdges(
  n: number,
  p: number,
  random: Random,
  options: RandomGraphOptions = {},
): EdgeList {
  const edges = emptyEdgeList(n, true);
  for (let u = 0; u < n; u++) {
    for (let v = 0; v < n; v++)
      if (u !== v && random() < p) push(edges, u, v, options.weighted ? random() : 1);
  }
  return edges;
}

export function randomGraph(
  n: number,
  p: number,
  random: Random,
  options?: RandomGraphOptions,
): WeightedGraph {
  return graphOf(randomGraphEdges(n, p, random, options));
}

export function randomDigraph(
  n: number,
  p: number,
  random: Random,
  options?: RandomGraphOptions,
): WeightedGraph {
  return graphOf(randomDigraphEdges(n, p, random, options));
}

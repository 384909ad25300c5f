import type { Core, EdgeCollection, ElementDefinition } from "cytoscape";
import type { GraphAnalysis } from "../compute/graph-analysis.js";
import { cytoscape } from "./cytoscape-setup.js";
import { graphStyle } from "./graph-style.js";
import { layoutEdgeCount, placeNodes } from "./node-placement.js";

/**
 * The graph drawn with cytoscape. Every edge is added once and shown or hidden as the threshold moves, so
 * node positions never change with the threshold; a threshold change touches only the edges that enter or
 * leave. A loop is drawn by marking its edges and nodes and fading the rest.
 */
export class GraphCanvas {
  readonly cy: Core;
  private readonly analysis: GraphAnalysis;
  /** Every edge, in entering order (edge number e is edges[e]). */
  private readonly edges: EdgeCollection;
  /** Edges shown: the first `shown` edges in entering order. */
  private shown: number;
  /** Edge number by node pair (u * n + v; both orders for undirected graphs). */
  private readonly edgeByPair = new Map<number, number>();
  private loopEdges: number[] = [];

  constructor(container: HTMLElement, analysis: GraphAnalysis) {
    this.analysis = analysis;
    const { n, sources, targets, labels } = analysis;
    const elements: ElementDefinition[] = [];
    for (let v = 0; v < n; v++) elements.push({ group: "nodes", data: { id: `n${v}`, label: labels[v] } });
    for (let e = 0; e < sources.length; e++) {
      elements.push({
        group: "edges",
        data: { id: `e${e}`, source: `n${sources[e]}`, target: `n${targets[e]}` },
      });
      this.edgeByPair.set(sources[e] * n + targets[e], e);
      if (!analysis.directed) this.edgeByPair.set(targets[e] * n + sources[e], e);
    }
    const large = sources.length > 5000;
    this.cy = cytoscape({
      container,
      elements,
      style: graphStyle(analysis.directed, n <= 120),
      layout: { name: "null" },
      minZoom: 0.05,
      maxZoom: 8,
      wheelSensitivity: 0.3,
      boxSelectionEnabled: false,
      // Large graphs: draw cached textures while panning or zooming instead of every edge.
      textureOnViewport: large,
      hideEdgesOnViewport: large,
      pixelRatio: large ? 1 : "auto",
    });
    this.edges = this.cy.edges();
    // The drawing follows its box: refit on resize until the person pans or zooms it themselves.
    let moved = false;
    this.cy.on("scrollzoom pinchzoom dragpan", () => {
      moved = true;
    });
    new ResizeObserver(() => {
      this.cy.resize();
      if (!moved) this.cy.fit(undefined, 24);
    }).observe(container);
    // Every edge starts hidden; the threshold control shows the first ones.
    this.edges.addClass("absent");
    this.shown = 0;
  }

  /** Places the nodes: the data's coordinates when given, else a force layout of the strongest edges. */
  async place(coordinates: Float64Array | null): Promise<void> {
    const layoutEdges = this.edges.slice(0, layoutEdgeCount(this.analysis));
    await placeNodes(this.cy, coordinates, layoutEdges);
    this.cy.fit(undefined, 24);
  }

  /** Shows exactly the first `count` edges (those present at the current threshold). */
  showEdges(count: number): void {
    if (count === this.shown) return;
    const [from, to] = count > this.shown ? [this.shown, count] : [count, this.shown];
    const changing = this.edges.slice(from, to);
    this.cy.batch(() => {
      if (count > this.shown) changing.removeClass("absent");
      else changing.addClass("absent");
    });
    this.shown = count;
  }

  /** Marks the loop given as node pairs [u0, v0, u1, v1, …] and fades the rest; null clears it. */
  showLoop(pairs: Int32Array | null): void {
    const cy = this.cy;
    cy.batch(() => {
      if (this.loopEdges.length > 0) cy.elements().removeClass("faded loop");
      this.loopEdges = [];
      if (!pairs) return;
      const ids: string[] = [];
      for (let i = 0; i < pairs.length; i += 2) {
        const e = this.edgeNumber(pairs[i], pairs[i + 1]);
        if (e === undefined) continue;
        this.loopEdges.push(e);
        ids.push(`#e${e}`, `#n${pairs[i]}`, `#n${pairs[i + 1]}`);
      }
      const loop = cy.$(ids.join(","));
      cy.elements().not(loop).addClass("faded");
      loop.addClass("loop");
    });
  }

  /** The number (entering order) of the edge between u and v (for directed graphs, the arc u → v first). */
  edgeNumber(u: number, v: number): number | undefined {
    const { n } = this.analysis;
    return this.edgeByPair.get(u * n + v) ?? this.edgeByPair.get(v * n + u);
  }

  /** Edge numbers (entering order) of the loop shown. */
  loopEdgeNumbers(): number[] {
    return [...this.loopEdges];
  }

  /** Node sizes from per-node values (simplices through each node), or back to one size. */
  sizeNodes(values: Float64Array | null): void {
    const nodes = this.cy.nodes();
    this.cy.batch(() => {
      if (!values) {
        nodes.removeClass("sized");
        return;
      }
      const max = Math.max(1, ...values);
      nodes.forEach((node, v) => {
        node.data("size", 6 + 26 * Math.sqrt(values[v] / max));
      });
      nodes.addClass("sized");
    });
  }

  destroy(): void {
    this.cy.destroy();
  }
}

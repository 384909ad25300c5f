import type { Core, EdgeCollection, ElementDefinition } from "cytoscape";
import type { GraphAnalysis } from "../compute/graph-analysis.js";
import { cytoscape } from "./cytoscape-setup.js";
import { graphStyle, loopLayerStyle } from "./graph-style.js";
import { layoutEdgeCount, placeNodes } from "./node-placement.js";

/**
 * The graph drawn with cytoscape. Every edge is added once and shown or hidden as the threshold moves, so
 * node positions never change with the threshold; a threshold change touches only the edges that enter or
 * leave. A loop is drawn on a second, small cytoscape layer above a veil that fades the graph, and the
 * graph itself is not touched: the cost depends on the loop's length, not on the size of the graph
 * (restyling 40,000 edges to fade them took seconds, and any change to the main drawing redraws every edge).
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
  /** The loop layer: its own cytoscape over a veil, following the main drawing's viewport. */
  private readonly loopLayer: Core;
  private readonly veil: HTMLElement;

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
    const layer = (name: string) => {
      const div = document.createElement("div");
      div.className = `graph-layer ${name}`;
      container.append(div);
      return div;
    };
    const base = layer("graph-base");
    this.veil = layer("graph-veil");
    this.veil.hidden = true;
    this.cy = cytoscape({
      container: base,
      // Positions never change: they are what makes thresholds comparable by eye.
      autoungrabify: true,
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
    this.loopLayer = cytoscape({
      container: layer("graph-loop"),
      style: loopLayerStyle(analysis.directed),
      userPanningEnabled: false,
      userZoomingEnabled: false,
      boxSelectionEnabled: false,
      autoungrabify: true,
      autounselectify: true,
    });
    this.cy.on("viewport", () => this.loopLayer.viewport({ zoom: this.cy.zoom(), pan: this.cy.pan() }));
    // The drawing follows its box: refit on resize until the person pans or zooms it themselves.
    let moved = false;
    this.cy.on("scrollzoom pinchzoom dragpan", () => {
      moved = true;
    });
    new ResizeObserver(() => {
      this.cy.resize();
      this.loopLayer.resize();
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

  /** Draws the loop given as node pairs [u0, v0, u1, v1, …] above the faded graph; null clears it. */
  showLoop(pairs: Int32Array | null): void {
    const cy = this.cy;
    const layer = this.loopLayer;
    this.loopEdges = [];
    layer.elements().remove();
    this.veil.hidden = pairs === null;
    if (!pairs) return;
    const nodes = new Set<number>();
    const elements: ElementDefinition[] = [];
    for (let i = 0; i < pairs.length; i += 2) {
      const e = this.edgeNumber(pairs[i], pairs[i + 1]);
      if (e === undefined) continue;
      this.loopEdges.push(e);
      nodes.add(pairs[i]).add(pairs[i + 1]);
      const edge = this.edges[e];
      elements.push({
        group: "edges",
        data: { id: `e${e}`, source: edge.source().id(), target: edge.target().id() },
      });
    }
    for (const v of nodes) {
      const node = cy.getElementById(`n${v}`);
      elements.unshift({
        group: "nodes",
        data: { id: `n${v}`, label: node.data("label") },
        position: { ...node.position() },
      });
    }
    layer.add(elements);
    layer.viewport({ zoom: cy.zoom(), pan: cy.pan() });
  }

  /** The loop as drawn on its layer: one [label, label] pair per edge (what a person sees emphasised). */
  shownLoop(): [string, string][] {
    return this.loopLayer.edges().map((edge) => [edge.source().data("label"), edge.target().data("label")]);
  }

  /** The drawing as one PNG: the graph, and over it the veil and the loop when one is shown. */
  async png(): Promise<Blob> {
    const options = { output: "blob-promise" as const, full: false, scale: 2, bg: "#ffffff" };
    const base = await this.cy.png(options);
    if (this.loopEdges.length === 0) return base;
    const loop = await this.loopLayer.png({ ...options, bg: undefined });
    const [under, over] = await Promise.all([createImageBitmap(base), createImageBitmap(loop)]);
    const canvas = new OffscreenCanvas(under.width, under.height);
    const context = canvas.getContext("2d")!;
    context.drawImage(under, 0, 0);
    context.fillStyle = getComputedStyle(this.veil).backgroundColor;
    context.fillRect(0, 0, canvas.width, canvas.height);
    context.drawImage(over, 0, 0, under.width, under.height);
    return canvas.convertToBlob({ type: "image/png" });
  }

  /** The number (entering order) of the edge between u and v (for directed graphs, the arc u → v first). */
  edgeNumber(u: number, v: number): number | undefined {
    const { n } = this.analysis;
    return this.edgeByPair.get(u * n + v) ?? this.edgeByPair.get(v * n + u);
  }

  /** Edge numbers (entering order) of the loop shown, in the loop's order. */
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
    this.loopLayer.destroy();
  }
}

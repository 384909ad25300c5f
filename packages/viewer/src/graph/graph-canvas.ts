import type { Core, ElementDefinition } from "cytoscape";
import type { GraphAnalysis } from "../compute/graph-analysis.js";
import { cytoscape } from "./cytoscape-setup.js";
import { EdgeLayer } from "./edge-layer.js";
import { graphStyle, loopLayerStyle, NODE_SIZE } from "./graph-style.js";
import { layoutEdgeCount, placeNodes } from "./node-placement.js";

/**
 * The graph drawn in three layers: the edges on a canvas of their own (EdgeLayer: the first edges in
 * entering order, as the threshold says), the nodes with cytoscape (which also owns pan, zoom and the
 * viewport), and a loop on a second, small cytoscape over a veil that fades the rest. Node positions never
 * change with the threshold. Cytoscape drew tens of thousands of edges one element at a time and redrew
 * them all on every change (a slider move took a second or more at 40,000 edges); the edge canvas strokes
 * them as a few long paths and, when the threshold adds edges, only the new ones. A loop costs what its
 * length costs: the main drawing is not touched.
 */
export class GraphCanvas {
  readonly cy: Core;
  private readonly analysis: GraphAnalysis;
  private readonly edgeLayer: EdgeLayer;
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
      this.edgeByPair.set(sources[e] * n + targets[e], e);
      if (!analysis.directed) this.edgeByPair.set(targets[e] * n + sources[e], e);
    }
    const large = sources.length > 5000;
    const pixelRatio = large ? 1 : window.devicePixelRatio || 1;
    this.edgeLayer = new EdgeLayer(container, analysis, pixelRatio);
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
      textureOnViewport: large,
      pixelRatio,
    });
    this.loopLayer = cytoscape({
      container: layer("graph-loop"),
      style: loopLayerStyle(analysis.directed),
      userPanningEnabled: false,
      userZoomingEnabled: false,
      boxSelectionEnabled: false,
      autoungrabify: true,
      autounselectify: true,
    });
    this.cy.on("viewport", () => {
      const viewport = { zoom: this.cy.zoom(), pan: this.cy.pan() };
      this.loopLayer.viewport(viewport);
      this.edgeLayer.setViewport(viewport);
    });
    // The drawing follows its box: refit on resize until the person pans or zooms it themselves.
    let moved = false;
    this.cy.on("scrollzoom pinchzoom dragpan", () => {
      moved = true;
    });
    new ResizeObserver(() => {
      this.cy.resize();
      this.loopLayer.resize();
      this.edgeLayer.resize();
      if (!moved) this.cy.fit(undefined, 24);
    }).observe(container);
    this.edgeLayer.resize();
    this.edgeLayer.setViewport({ zoom: this.cy.zoom(), pan: this.cy.pan() });
  }

  /** Places the nodes: the data's coordinates when given, else a force layout of the strongest edges. */
  async place(coordinates: Float64Array | null): Promise<void> {
    const { sources, targets } = this.analysis;
    // The force layout pulls along the strongest edges: they join cytoscape for the layout only.
    const layoutEdges = this.cy.add(
      Array.from({ length: coordinates ? 0 : layoutEdgeCount(this.analysis) }, (_, e) => ({
        group: "edges" as const,
        data: { id: `e${e}`, source: `n${sources[e]}`, target: `n${targets[e]}` },
      })),
    );
    await placeNodes(this.cy, coordinates, layoutEdges);
    this.cy.remove(layoutEdges);
    this.cy.fit(undefined, 24);
    this.updateEdgeEnds();
  }

  /** Shows exactly the first `count` edges (those present at the current threshold). */
  showEdges(count: number): void {
    this.edgeLayer.show(count);
  }

  /** Edges shown at the current threshold. */
  shownEdgeCount(): number {
    return this.edgeLayer.shownCount();
  }

  /** Edges in the drawing on screen (drawing now what waits for the next frame). */
  drawnEdgeCount(): number {
    return this.edgeLayer.drawnEdges();
  }

  /** Tells the edge layer where the nodes are and how large they are drawn. */
  private updateEdgeEnds(): void {
    const n = this.analysis.n;
    const xy = new Float64Array(2 * n);
    const radii = new Float64Array(n);
    this.cy.nodes().forEach((node, v) => {
      const p = node.position();
      xy[2 * v] = p.x;
      xy[2 * v + 1] = p.y;
      radii[v] = (node.hasClass("sized") ? Number(node.data("size")) : NODE_SIZE) / 2;
    });
    this.edgeLayer.setNodes(xy, radii);
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
      elements.push({
        group: "edges",
        data: { id: `e${e}`, source: `n${this.analysis.sources[e]}`, target: `n${this.analysis.targets[e]}` },
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

  /** The drawing as one PNG: the edges and nodes, and over them the veil and the loop when one is shown. */
  async png(): Promise<Blob> {
    const scale = 2;
    const options = { output: "blob-promise" as const, full: false, scale };
    const nodes = await createImageBitmap(await this.cy.png(options));
    const canvas = new OffscreenCanvas(nodes.width, nodes.height);
    const context = canvas.getContext("2d")!;
    context.fillStyle = "#ffffff";
    context.fillRect(0, 0, canvas.width, canvas.height);
    // The edges at the saved picture's scale, under the nodes, as on screen.
    const zoom = this.cy.zoom();
    const pan = this.cy.pan();
    context.setTransform(zoom * scale, 0, 0, zoom * scale, pan.x * scale, pan.y * scale);
    this.edgeLayer.strokeEdges(context, 0, this.edgeLayer.shownCount());
    context.setTransform(1, 0, 0, 1, 0, 0);
    context.drawImage(nodes, 0, 0);
    if (this.loopEdges.length > 0) {
      const loop = await createImageBitmap(await this.loopLayer.png(options));
      context.fillStyle = getComputedStyle(this.veil).backgroundColor;
      context.fillRect(0, 0, canvas.width, canvas.height);
      context.drawImage(loop, 0, 0, canvas.width, canvas.height);
    }
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
    this.updateEdgeEnds();
  }

  destroy(): void {
    this.cy.destroy();
    this.loopLayer.destroy();
    this.edgeLayer.destroy();
  }
}

import { PALETTE } from "../palette.js";

/** Cytoscape's viewport: model coordinates times zoom, plus pan, give CSS pixels. */
export interface Viewport {
  zoom: number;
  pan: { x: number; y: number };
}

/** Edges stroked per path: long enough to batch, short enough to keep each path's rasterisation cheap. */
const EDGES_PER_PATH = 2000;
/**
 * The drawing of the first k × CHECKPOINT_EDGES edges is kept as a picture, so a move that removes edges
 * starts from the nearest kept picture below it instead of a clear canvas: any move strokes fewer than this
 * many edges, plus the edges it adds. About 2 MB of pixels per picture at 1000 × 500.
 */
const CHECKPOINT_EDGES = 4000;
/**
 * While the view pans or zooms, the drawing is moved as a picture (as cytoscape moves its nodes' texture),
 * and the edges are stroked again once the viewport has been still this long: stroking 40,000 edges takes
 * about 50 ms, longer than a frame.
 */
export const SETTLE_MS = 150;
/** Arrowheads as cytoscape draws `triangle` at arrow-scale 0.7 on a 1-unit edge: about 6 units long and wide. */
const ARROW_LENGTH = 6;
const ARROW_HALF_WIDTH = 3;
/** Scratch for arrowFrame: ux, uy, tip, base of the arc being drawn (no allocation per edge). */
const arrow = new Float64Array(4);

/**
 * The graph's edges, drawn on one canvas under cytoscape's nodes: the first `count` edges in entering order,
 * stroked as a few long paths in model coordinates (width 1 model unit, as cytoscape draws them), arrowheads
 * for directed graphs. Cytoscape drew each edge as an element and redrew them all on any change (about a
 * second at 20,000 edges); here a threshold that adds edges strokes only the new ones over the drawing,
 * and one that removes edges redraws the rest at once. Drawing waits for the next animation frame, so many
 * moves within one frame cost one drawing.
 */
export class EdgeLayer {
  readonly canvas: HTMLCanvasElement;
  private readonly context: CanvasRenderingContext2D;
  private readonly sources: Int32Array;
  private readonly targets: Int32Array;
  private readonly directed: boolean;
  private readonly pixelRatio: number;
  /** Node centres (x, y per node) and radii, in model units. */
  private readonly xy: Float64Array;
  private readonly radii: Float64Array;
  private viewport: Viewport = { zoom: 1, pan: { x: 0, y: 0 } };
  /** Edges that should be drawn, and edges the canvas holds now (null: it must be cleared first). */
  private count = 0;
  private drawn: number | null = null;
  private frame = 0;
  /** checkpoints[k]: the canvas's pixels with the first k × CHECKPOINT_EDGES edges drawn (k ≥ 1). */
  private checkpoints: (OffscreenCanvas | undefined)[] = [];
  /** While the viewport moves: the complete drawing as it was when the move began, and its viewport. */
  private still: OffscreenCanvas | null = null;
  private stillViewport: Viewport = { zoom: 1, pan: { x: 0, y: 0 } };
  private settleTimer: ReturnType<typeof setTimeout> | null = null;

  constructor(
    container: HTMLElement,
    edges: { sources: Int32Array; targets: Int32Array; directed: boolean; n: number },
    pixelRatio: number,
  ) {
    this.sources = edges.sources;
    this.targets = edges.targets;
    this.directed = edges.directed;
    this.pixelRatio = pixelRatio;
    this.xy = new Float64Array(2 * edges.n);
    this.radii = new Float64Array(edges.n).fill(4.5);
    this.canvas = document.createElement("canvas");
    this.canvas.className = "graph-layer graph-edges";
    container.append(this.canvas);
    this.context = this.canvas.getContext("2d")!;
  }

  /** Node centres and radii (model units), after the nodes are placed or resized. */
  setNodes(xy: Float64Array, radii: Float64Array): void {
    this.xy.set(xy);
    this.radii.set(radii);
    this.invalidate();
  }

  /**
   * Follows a pan or zoom. A complete drawing is moved as a picture at each frame, and stroked again once
   * the viewport has been still for SETTLE_MS.
   */
  setViewport(viewport: Viewport): void {
    if (this.still === null && this.count > 0 && this.drawn === this.count && this.frame === 0) {
      this.still = new OffscreenCanvas(this.canvas.width, this.canvas.height);
      this.still.getContext("2d")!.drawImage(this.canvas, 0, 0);
      this.stillViewport = this.viewport;
    }
    this.viewport = { zoom: viewport.zoom, pan: { ...viewport.pan } };
    if (this.still === null) {
      this.invalidate();
      return;
    }
    this.drawn = null;
    this.checkpoints = [];
    if (this.settleTimer !== null) clearTimeout(this.settleTimer);
    this.settleTimer = setTimeout(() => this.settle(), SETTLE_MS);
    this.schedule();
  }

  /** Ends a move of the viewport: the edges are stroked again at the next frame. */
  private settle(): void {
    if (this.still !== null) this.invalidate();
  }

  /** Draws the picture taken when the move began where the current viewport puts it. */
  private drawStill(): void {
    const context = this.context;
    const r = this.pixelRatio;
    const from = this.stillViewport;
    const to = this.viewport;
    // A model point at pixel p before is at p · s + (pan − pan_before · s) · r now, s the zoom's ratio.
    const s = to.zoom / from.zoom;
    context.setTransform(1, 0, 0, 1, 0, 0);
    context.clearRect(0, 0, this.canvas.width, this.canvas.height);
    context.setTransform(s, 0, 0, s, (to.pan.x - from.pan.x * s) * r, (to.pan.y - from.pan.y * s) * r);
    context.drawImage(this.still as OffscreenCanvas, 0, 0);
  }

  /** Matches the canvas to its box (CSS pixels times the pixel ratio). */
  resize(): void {
    const width = Math.max(1, Math.round(this.canvas.clientWidth * this.pixelRatio));
    const height = Math.max(1, Math.round(this.canvas.clientHeight * this.pixelRatio));
    if (width === this.canvas.width && height === this.canvas.height) return;
    this.canvas.width = width;
    this.canvas.height = height;
    this.invalidate();
  }

  /** Shows exactly the first `count` edges; drawn at the next animation frame. */
  show(count: number): void {
    if (count === this.count) return;
    // The moving picture holds the old edges: stroke the new ones at once.
    this.settle();
    // Fewer edges than drawn: start again from a kept picture or a clear canvas.
    if (this.drawn !== null && count < this.drawn) this.drawn = null;
    this.count = count;
    this.schedule();
  }

  /** How many edges are drawn (drawing now what is pending). */
  drawnEdges(): number {
    this.settle();
    this.flush();
    return this.drawn ?? 0;
  }

  /** Draws what is pending now instead of at the next frame. */
  flush(): void {
    if (this.frame) cancelAnimationFrame(this.frame);
    this.frame = 0;
    if (this.still !== null) {
      this.drawStill();
      return;
    }
    const count = this.count;
    if (this.drawn === count) return;
    const context = this.context;
    // Start from the kept picture nearest below the goal when it is ahead of what the canvas holds.
    let k = Math.min(Math.floor(count / CHECKPOINT_EDGES), this.checkpoints.length - 1);
    while (k > 0 && !this.checkpoints[k]) k--;
    const kept = k > 0 ? k * CHECKPOINT_EDGES : 0;
    if (this.drawn === null || kept > this.drawn) {
      context.setTransform(1, 0, 0, 1, 0, 0);
      context.clearRect(0, 0, this.canvas.width, this.canvas.height);
      if (k > 0) context.drawImage(this.checkpoints[k]!, 0, 0);
      this.drawn = kept;
    }
    const { zoom, pan } = this.viewport;
    const r = this.pixelRatio;
    let from = this.drawn;
    while (from < count) {
      // Stroke up to the next checkpoint, and keep the picture there if it is not kept yet.
      const next = (Math.floor(from / CHECKPOINT_EDGES) + 1) * CHECKPOINT_EDGES;
      const to = Math.min(count, next);
      context.setTransform(zoom * r, 0, 0, zoom * r, pan.x * r, pan.y * r);
      this.strokeEdges(context, from, to);
      if (to === next && !this.checkpoints[to / CHECKPOINT_EDGES]) this.keep(to / CHECKPOINT_EDGES);
      from = to;
    }
    this.drawn = count;
  }

  private keep(k: number): void {
    const picture = new OffscreenCanvas(this.canvas.width, this.canvas.height);
    picture.getContext("2d")!.drawImage(this.canvas, 0, 0);
    this.checkpoints[k] = picture;
  }

  /**
   * Strokes edges [from, to) in model coordinates on a context whose transform maps the model to its
   * pixels (also used to draw the edges into a saved picture).
   */
  strokeEdges(
    context: CanvasRenderingContext2D | OffscreenCanvasRenderingContext2D,
    from: number,
    to: number,
  ) {
    const { sources, targets, xy, radii, directed } = this;
    context.lineWidth = 1;
    context.strokeStyle = PALETTE.edge;
    context.fillStyle = PALETTE.edge;
    context.lineCap = "butt";
    for (let start = from; start < to; start += EDGES_PER_PATH) {
      const end = Math.min(to, start + EDGES_PER_PATH);
      context.beginPath();
      for (let e = start; e < end; e++) {
        const s = sources[e];
        const t = targets[e];
        const x0 = xy[2 * s];
        const y0 = xy[2 * s + 1];
        const x1 = xy[2 * t];
        const y1 = xy[2 * t + 1];
        if (!directed) {
          // Centre to centre, as cytoscape's haystack edges.
          context.moveTo(x0, y0);
          context.lineTo(x1, y1);
          continue;
        }
        // Border to the arrowhead's base; the arrowhead's tip touches the target's border.
        if (!this.arrowFrame(e)) continue;
        const ux = arrow[0];
        const uy = arrow[1];
        const base = arrow[3];
        context.moveTo(x0 + ux * radii[s], y0 + uy * radii[s]);
        context.lineTo(x0 + ux * base, y0 + uy * base);
      }
      context.stroke();
      if (!directed) continue;
      context.beginPath();
      for (let e = start; e < end; e++) {
        if (!this.arrowFrame(e)) continue;
        const s = sources[e];
        const x0 = xy[2 * s];
        const y0 = xy[2 * s + 1];
        const ux = arrow[0];
        const uy = arrow[1];
        const tip = arrow[2];
        const base = arrow[3];
        context.moveTo(x0 + ux * tip, y0 + uy * tip);
        context.lineTo(x0 + ux * base - uy * ARROW_HALF_WIDTH, y0 + uy * base + ux * ARROW_HALF_WIDTH);
        context.lineTo(x0 + ux * base + uy * ARROW_HALF_WIDTH, y0 + uy * base - ux * ARROW_HALF_WIDTH);
        context.closePath();
      }
      context.fill();
    }
  }

  /**
   * Writes arc e's unit direction and the distances of its arrowhead's tip and base from the source's centre
   * into `arrow` (shaft and head read the same numbers); false when the nodes overlap so far that no shaft
   * is left to draw.
   */
  private arrowFrame(e: number): boolean {
    const { sources, targets, xy, radii } = this;
    const s = sources[e];
    const t = targets[e];
    const dx = xy[2 * t] - xy[2 * s];
    const dy = xy[2 * t + 1] - xy[2 * s + 1];
    const length = Math.hypot(dx, dy) || 1;
    const tip = length - radii[t];
    const base = tip - ARROW_LENGTH;
    arrow[0] = dx / length;
    arrow[1] = dy / length;
    arrow[2] = tip;
    arrow[3] = base;
    return !(base <= radii[s]);
  }

  /** Edges shown at the current threshold. */
  shownCount(): number {
    return this.count;
  }

  private invalidate(): void {
    // New nodes, a new size or the end of a move: no moving picture any more.
    this.still = null;
    if (this.settleTimer !== null) clearTimeout(this.settleTimer);
    this.settleTimer = null;
    this.drawn = null;
    this.checkpoints = [];
    this.schedule();
  }

  private schedule(): void {
    if (this.frame) return;
    this.frame = requestAnimationFrame(() => {
      this.frame = 0;
      this.flush();
    });
  }

  destroy(): void {
    if (this.frame) cancelAnimationFrame(this.frame);
    if (this.settleTimer !== null) clearTimeout(this.settleTimer);
    this.canvas.remove();
  }
}

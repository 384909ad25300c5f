import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { seededRandom } from "../../../../test/support/random.js";
import { EdgeLayer, SETTLE_MS } from "./edge-layer.js";

/**
 * A stand-in for a 2-D canvas that records which edges its pixels hold: a stroked path adds the edges it
 * traced (recognised by their end points), clearRect empties it, drawImage copies another canvas's edges.
 * Each edge should be on the drawing exactly once, whatever order of moves brought it there.
 */
class RecordingCanvas {
  className = "";
  width = 300;
  height = 150;
  clientWidth = 300;
  clientHeight = 150;
  /** Edge number → times it was stroked onto these pixels. */
  held = new Map<number, number>();
  /** Lines traced so far, drawn or not. */
  traced = 0;
  /** The last transform set (a, b, c, d, e, f). */
  transform: number[] = [1, 0, 0, 1, 0, 0];
  private path: number[] = [];
  private from = -1;
  constructor(private readonly edgeAt: (s: number, t: number) => number) {}
  getContext() {
    const canvas = this;
    return {
      canvas,
      lineWidth: 1,
      strokeStyle: "",
      fillStyle: "",
      lineCap: "",
      setTransform(...matrix: number[]) {
        canvas.transform = matrix;
      },
      clearRect() {
        canvas.held.clear();
      },
      drawImage(source: RecordingCanvas) {
        for (const [e, times] of source.held) canvas.held.set(e, (canvas.held.get(e) ?? 0) + times);
      },
      beginPath() {
        canvas.path = [];
      },
      // Node v sits at (v, 0): a move then a line name the edge's two ends.
      moveTo(x: number) {
        canvas.from = x;
      },
      lineTo(x: number) {
        canvas.traced++;
        canvas.path.push(canvas.edgeAt(canvas.from, x));
      },
      stroke() {
        for (const e of canvas.path) canvas.held.set(e, (canvas.held.get(e) ?? 0) + 1);
      },
      closePath() {},
      fill() {},
    };
  }
  remove() {}
}

describe("EdgeLayer", () => {
  // A graph whose edge e joins nodes e and e + 1, so every edge has its own ends.
  const m = 13_000;
  const sources = Int32Array.from({ length: m }, (_, e) => e);
  const targets = Int32Array.from({ length: m }, (_, e) => e + 1);
  const edgeAt = (s: number, t: number) => (t === s + 1 ? s : -1);
  let frames: (() => void)[] = [];

  beforeEach(() => {
    frames = [];
    vi.stubGlobal("document", { createElement: () => new RecordingCanvas(edgeAt) });
    vi.stubGlobal(
      "OffscreenCanvas",
      class {
        constructor() {
          // biome-ignore lint/correctness/noConstructorReturn: the stand-in records pixels as edges.
          return new RecordingCanvas(edgeAt);
        }
      },
    );
    vi.stubGlobal("requestAnimationFrame", (callback: () => void) => frames.push(callback));
    vi.stubGlobal("cancelAnimationFrame", () => {});
  });
  afterEach(() => vi.unstubAllGlobals());

  function layer(pixelRatio = 1): { edges: EdgeLayer; canvas: RecordingCanvas } {
    const container = { append() {} } as unknown as HTMLElement;
    const edges = new EdgeLayer(container, { sources, targets, directed: false, n: m + 1 }, pixelRatio);
    const xy = new Float64Array(2 * (m + 1));
    for (let v = 0; v <= m; v++) xy[2 * v] = v;
    edges.setNodes(xy, new Float64Array(m + 1).fill(4.5));
    return { edges, canvas: edges.canvas as unknown as RecordingCanvas };
  }

  /** The drawing holds exactly the first `count` edges, each once. */
  function expectFirst(canvas: RecordingCanvas, count: number) {
    const held = [...canvas.held.entries()].sort((a, b) => a[0] - b[0]);
    expect(held.length).toBe(count);
    expect(held.every(([e, times], i) => e === i && times === 1)).toBe(true);
  }

  it("holds exactly the first edges after any sequence of moves, checkpoints and viewport changes", () => {
    const { edges, canvas } = layer();
    // Seeded moves: up, down, onto checkpoints, across them and within one.
    const random = seededRandom(2026);
    for (let move = 0; move < 400; move++) {
      const count = move % 7 === 0 ? 4000 * Math.floor(random() * 4) : Math.floor(random() * (m + 1));
      edges.show(count);
      if (move % 3 === 0) {
        // Several moves in one frame draw once, at the frame.
        edges.show(Math.floor(random() * (m + 1)));
        edges.show(count);
      }
      if (move % 50 === 25) edges.setViewport({ zoom: 1 + random(), pan: { x: 0, y: 0 } });
      for (const frame of frames.splice(0)) frame();
      expect(edges.drawnEdges()).toBe(count);
      expectFirst(canvas, count);
    }
  });

  it("traces only the added edges when the threshold adds edges, and at most a checkpoint's worth going down", () => {
    const { edges, canvas } = layer();
    edges.show(9000);
    edges.flush();
    let traced = canvas.traced;
    edges.show(9100);
    edges.flush();
    expect(canvas.traced - traced).toBe(100);
    traced = canvas.traced;
    // Down to 8,500: from the picture kept at 8,000 edges, then 500 more.
    edges.show(8500);
    edges.flush();
    expect(canvas.traced - traced).toBe(500);
    expectFirst(canvas, 8500);
  });

  describe("while the viewport moves", () => {
    beforeEach(() => vi.useFakeTimers({ toFake: ["setTimeout", "clearTimeout"] }));
    afterEach(() => vi.useRealTimers());
    const runFrames = () => {
      for (const frame of frames.splice(0)) frame();
    };

    it("moves the drawing as a picture, and strokes the edges again once the viewport is still", () => {
      const { edges, canvas } = layer();
      edges.show(9000);
      edges.flush();
      const traced = canvas.traced;
      // From zoom 1, pan (0, 0): zoom 2 and pan (10, −5) scale the picture by 2 and shift it by the pan.
      edges.setViewport({ zoom: 2, pan: { x: 10, y: -5 } });
      runFrames();
      expect(canvas.traced).toBe(traced);
      expect(canvas.transform).toEqual([2, 0, 0, 2, 10, -5]);
      expectFirst(canvas, 9000);
      // Each move within SETTLE_MS of the last puts the stroking off again.
      vi.advanceTimersByTime(SETTLE_MS - 50);
      edges.setViewport({ zoom: 2, pan: { x: 20, y: -5 } });
      runFrames();
      expect(canvas.transform).toEqual([2, 0, 0, 2, 20, -5]);
      vi.advanceTimersByTime(SETTLE_MS - 50);
      runFrames();
      expect(canvas.traced).toBe(traced);
      vi.advanceTimersByTime(50);
      runFrames();
      expect(canvas.traced).toBe(traced + 9000);
      expect(canvas.transform).toEqual([2, 0, 0, 2, 20, -5]);
      expectFirst(canvas, 9000);
    });

    it("maps the picture through the pixel ratio and the zoom it was drawn at", () => {
      // Worked by hand: a model x is at pixel (0.5 x + 4) · 2 = x + 8 before and (x + 10) · 2 = 2x + 20
      // after, which is 2 · (x + 8) + 4: scale 2, shift 4; in y, (0.5 y + 6) · 2 = y + 12 goes to
      // 2y = 2 · (y + 12) − 24.
      const { edges, canvas } = layer(2);
      edges.setViewport({ zoom: 0.5, pan: { x: 4, y: 6 } });
      edges.show(100);
      edges.flush();
      edges.setViewport({ zoom: 1, pan: { x: 10, y: 0 } });
      runFrames();
      expect(canvas.transform).toEqual([2, 0, 0, 2, 4, -24]);
    });

    it("strokes at once the edges of a threshold moved during a pan, and not again when it settles", () => {
      const { edges, canvas } = layer();
      edges.show(9000);
      edges.flush();
      edges.setViewport({ zoom: 1, pan: { x: 30, y: 0 } });
      runFrames();
      edges.show(5000);
      runFrames();
      expectFirst(canvas, 5000);
      expect(canvas.transform).toEqual([1, 0, 0, 1, 30, 0]);
      const traced = canvas.traced;
      vi.advanceTimersByTime(2 * SETTLE_MS);
      runFrames();
      expect(canvas.traced).toBe(traced);
      expectFirst(canvas, 5000);
    });
  });
});

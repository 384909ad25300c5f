import { BarcodeChart } from "./charts/barcode-chart.js";
import { chartSvg } from "./charts/chart-host.js";
import { CurvesChart } from "./charts/curves-chart.js";
import { DiagramChart } from "./charts/diagram-chart.js";
import type { AnalysisClient } from "./compute/analysis-client.js";
import type { GraphAnalysis } from "./compute/graph-analysis.js";
import type { OpenedGraph } from "./compute/worker-protocol.js";
import { h } from "./dom.js";
import { download, exportStem } from "./export/download.js";
import { graphSvg } from "./export/graph-svg.js";
import { loopCsv } from "./export/loop-csv.js";
import { formatWeight } from "./format.js";
import { GraphCanvas } from "./graph/graph-canvas.js";
import { loopWalk } from "./graph/loop-walk.js";
import { LoopList } from "./panels/loop-list.js";
import { NumbersPanel } from "./panels/numbers-panel.js";
import { ThresholdControl } from "./panels/threshold-control.js";

/** What the tests and benchmarks read from a graph page (the same state a person sees). */
export interface GraphPageHandle {
  analysis: GraphAnalysis;
  canvas: GraphCanvas;
  control: ThresholdControl;
  /** Moves to a threshold step as the slider does. */
  moveTo(index: number): void;
  /** Chooses a bar as a click in the barcode does; resolves once its loop is drawn. */
  chooseBar(bar: number): Promise<void>;
  /** The representative loop of an H1 bar, as node pairs (from the worker once, then remembered). */
  loopOf(bar: number): Promise<Int32Array>;
  loopBars: number[];
}

/**
 * One graph: the drawing with its threshold, the numbers there, the loop list, and the curves, barcode and
 * diagram. Choosing a bar anywhere moves the threshold to its birth and draws its loop.
 */
export async function showGraphPage(
  root: HTMLElement,
  opened: OpenedGraph,
  client: AnalysisClient,
  title: string,
  back?: { label: string; go: () => void },
): Promise<GraphPageHandle> {
  const { analysis } = opened;
  const stem = exportStem(title);
  const stage = h("div", { class: "stage", role: "img", "aria-label": `Graph ${title}` });
  const status = h("p", { class: "status", role: "status" });
  const loops = new Map<number, Int32Array>();
  let chosen: number | null = null;
  let sized = false;

  const control = new ThresholdControl(analysis, (index) => applyThreshold(index));
  const numbers = new NumbersPanel(analysis);
  const list = new LoopList(analysis, (bar) => void chooseBar(bar));

  const sizeToggle = h("input", { type: "checkbox", id: "size-by-participation" });
  const toolbar = h(
    "div",
    { class: "toolbar" },
    ...(back ? [button(`← ${back.label}`, back.go)] : []),
    h("strong", { class: "graph-title" }, title),
    h(
      "span",
      { class: "graph-kind" },
      `${analysis.n} nodes · ${analysis.sources.length} edges · ${analysis.directed ? "directed" : "undirected"} · ${analysis.semantics} weights`,
    ),
    h("label", { class: "toggle" }, sizeToggle, " node size: simplices through it"),
    h("span", { class: "spacer" }),
    h("span", { class: "toggle" }, "Save"),
    button("PNG", () => void canvas.png().then((png) => download(`${stem}.png`, png))),
    button("SVG", () =>
      download(
        `${stem}.svg`,
        graphSvg(canvas.cy, analysis, canvas.shownEdgeCount(), title, canvas.loopEdgeNumbers()),
        "image/svg+xml",
      ),
    ),
    button("loop CSV", () => {
      if (chosen === null || !loops.has(chosen)) {
        status.textContent = "Choose a loop first (in the list, the barcode or the diagram).";
        return;
      }
      download(
        `${stem}-loop-bar${chosen}.csv`,
        loopCsv(analysis, loops.get(chosen)!, (u, v) => canvas.edgeNumber(u, v)),
        "text/csv",
      );
    }),
  );

  const figure = (id: string, caption: string) => {
    const body = h("div", { class: "chart", id });
    const save = h("button", { type: "button", class: "small" }, "SVG");
    const element = h("figure", { class: "panel chart-panel" }, h("figcaption", {}, caption, save), body);
    return { element, body, save };
  };
  const curvesFigure = figure("curves-chart", "Betti and Euler curves");
  const barcodeFigure = figure("barcode-chart", "Barcode");
  const diagramFigure = figure("diagram-chart", "Persistence diagram");

  root.replaceChildren(
    h(
      "div",
      { class: "graph-page" },
      h("div", { class: "graph-main" }, toolbar, stage, status),
      h("aside", { class: "side" }, control.element, numbers.element, list.element),
      h("div", { class: "charts" }, curvesFigure.element, barcodeFigure.element, diagramFigure.element),
    ),
  );
  if (opened.warnings.length > 0) status.textContent = opened.warnings.join("; ");

  const canvas = new GraphCanvas(stage, analysis);
  await canvas.place(opened.coordinates);
  const curves = new CurvesChart(curvesFigure.body, analysis);
  const barcode = new BarcodeChart(barcodeFigure.body, analysis, (bar) => void chooseBar(bar));
  const diagram = new DiagramChart(diagramFigure.body, analysis, (bar) => void chooseBar(bar));
  curvesFigure.save.addEventListener("click", () =>
    download(`${stem}-curves.svg`, curves.svg(), "image/svg+xml"),
  );
  barcodeFigure.save.addEventListener("click", () =>
    download(`${stem}-barcode.svg`, chartSvg(barcode.chart), "image/svg+xml"),
  );
  diagramFigure.save.addEventListener("click", () =>
    download(`${stem}-diagram.svg`, diagram.svg(), "image/svg+xml"),
  );

  let participationRequest = 0;
  async function refreshSizes(): Promise<void> {
    if (!sized) {
      canvas.sizeNodes(null);
      return;
    }
    const ticket = ++participationRequest;
    const values = await client.request<Float64Array>({
      kind: "participation",
      threshold: control.threshold(),
    });
    if (ticket === participationRequest && sized) canvas.sizeNodes(values);
  }
  sizeToggle.addEventListener("change", () => {
    sized = sizeToggle.checked;
    void refreshSizes().catch(showError);
  });

  function applyThreshold(index: number): void {
    canvas.showEdges(analysis.thresholds.length > 0 ? analysis.edgesAt[index] : 0);
    numbers.show(index);
    // The chart marker and node sizes follow after the graph and numbers are drawn.
    requestAnimationFrame(() => curves.mark(control.threshold()));
    if (sized) void refreshSizes().catch(showError);
  }

  function moveTo(index: number): void {
    control.set(index);
    applyThreshold(control.index);
  }

  async function loopOf(bar: number): Promise<Int32Array> {
    let pairs = loops.get(bar);
    if (!pairs) {
      pairs = await client.request<Int32Array>({ kind: "loop", bar });
      loops.set(bar, pairs);
    }
    return pairs;
  }

  async function chooseBar(bar: number): Promise<void> {
    const info = analysis.bars[bar];
    chosen = bar;
    moveTo(control.indexFor(info.birth));
    barcode.choose(bar);
    diagram.choose(bar);
    if (info.dim !== 1) {
      canvas.showLoop(null);
      list.choose(null);
      status.textContent = `H${info.dim} bar ${bar}: born at ${formatWeight(info.birth)}. Loops are drawn for H1 bars.`;
      return;
    }
    const pairs = await loopOf(bar);
    if (chosen !== bar) return;
    canvas.showLoop(pairs);
    const labels = loopWalk(pairs).map((v) => analysis.labels[v]);
    list.choose(bar, labels);
    status.textContent = `Loop of H1 bar ${bar}: ${labels.join(" – ")} (${pairs.length / 2} edges, present from ${formatWeight(info.birth)}).`;
  }

  function showError(error: unknown): void {
    status.textContent = error instanceof Error ? error.message : String(error);
  }

  // Start in the middle of the edges, then name the listed loops as the worker finds them.
  moveTo(
    analysis.thresholds.length > 0
      ? control.indexFor(analysis.weights[Math.floor((analysis.weights.length - 1) / 2)])
      : 0,
  );
  for (const bar of list.bars) {
    const pairs = await loopOf(bar);
    list.name(
      bar,
      loopWalk(pairs).map((v) => analysis.labels[v]),
    );
  }
  return { analysis, canvas, control, moveTo, chooseBar, loopOf, loopBars: list.bars };
}

function button(label: string, action: () => void): HTMLButtonElement {
  const element = h("button", { type: "button" }, label);
  element.addEventListener("click", action);
  return element;
}

import { possibleEdgeCount } from "@cliquescape/core";
import type { GraphAnalysis } from "../compute/graph-analysis.js";
import { h } from "../dom.js";
import { formatCount } from "../format.js";

/** Nodes, edges, density, simplices per dimension, Euler characteristic and Betti numbers at one step. */
export class NumbersPanel {
  readonly element: HTMLElement;
  private readonly analysis: GraphAnalysis;
  private readonly cells = new Map<string, HTMLElement>();

  constructor(analysis: GraphAnalysis) {
    this.analysis = analysis;
    const cell = (key: string) => {
      const td = h("td", { "data-field": key });
      this.cells.set(key, td);
      return td;
    };
    const summary = h(
      "table",
      { class: "numbers" },
      h(
        "tbody",
        {},
        ...["nodes", "edges", "density", "euler"].map((key) =>
          h("tr", {}, h("th", { scope: "row" }, key === "euler" ? "Euler characteristic χ" : key), cell(key)),
        ),
      ),
    );
    const dims = Math.max(analysis.countDims, analysis.bettiDims);
    const perDim = h(
      "table",
      { class: "numbers per-dim" },
      h(
        "thead",
        {},
        h(
          "tr",
          {},
          h("th", { scope: "col" }, "dim k"),
          h("th", { scope: "col" }, analysis.directed ? "directed simplices" : "simplices"),
          h("th", { scope: "col" }, `β_k (Z/${analysis.prime})`),
        ),
      ),
      h(
        "tbody",
        {},
        ...Array.from({ length: dims }, (_, k) =>
          h("tr", {}, h("th", { scope: "row" }, String(k)), cell(`count-${k}`), cell(`betti-${k}`)),
        ),
      ),
    );
    this.note = h("p", { class: "note" });
    this.element = h(
      "section",
      { class: "panel numbers-panel", "aria-labelledby": "numbers-title" },
      h("h2", { id: "numbers-title" }, "At this threshold"),
      summary,
      perDim,
      this.note,
    );
  }

  private readonly note: HTMLElement;

  show(index: number): void {
    const a = this.analysis;
    const set = (key: string, text: string) => {
      const td = this.cells.get(key);
      if (td) td.textContent = text;
    };
    const edges = a.thresholds.length > 0 ? a.edgesAt[index] : 0;
    const possible = possibleEdgeCount(a.n, a.directed);
    set("nodes", formatCount(a.n));
    set("edges", formatCount(edges));
    set("density", possible === 0 ? "0" : (edges / possible).toFixed(4));
    set("euler", a.thresholds.length > 0 ? String(a.euler[index]) : String(a.n));
    for (let k = 0; k < Math.max(a.countDims, a.bettiDims); k++) {
      const count = k < a.countDims ? a.counts[index * a.countDims + k] : undefined;
      set(`count-${k}`, count === undefined ? "–" : formatCount(count));
      set(`betti-${k}`, k < a.bettiDims ? String(a.betti[index * a.bettiDims + k]) : "–");
    }
    this.note.textContent = a.truncated
      ? "Simplices above the top dimension were not counted: χ is a partial sum."
      : "";
  }
}

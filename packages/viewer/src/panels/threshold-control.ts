import { toFiltrationValue } from "@cliquescape/core";
import type { GraphAnalysis } from "../compute/graph-analysis.js";
import { h } from "../dom.js";
import { formatWeight, keepRule } from "../format.js";

/**
 * The threshold: a slider over the distinct edge values (one step adds the edges of the next value; arrow
 * keys step, Page Up/Down jump a tenth) and a box to type any weight, which snaps to the edges it keeps.
 */
export class ThresholdControl {
  readonly element: HTMLElement;
  private readonly slider: HTMLInputElement;
  private readonly typed: HTMLInputElement;
  private readonly rule: HTMLElement;
  private readonly analysis: GraphAnalysis;
  index = 0;

  constructor(analysis: GraphAnalysis, onChange: (index: number) => void) {
    this.analysis = analysis;
    const T = analysis.thresholds.length;
    this.slider = h("input", {
      type: "range",
      id: "threshold-slider",
      min: 0,
      max: Math.max(0, T - 1),
      step: 1,
      "aria-label": "Threshold: slide right to add weaker edges",
      disabled: T === 0,
    });
    this.typed = h("input", {
      type: "number",
      id: "threshold-value",
      step: "any",
      "aria-label": "Threshold weight",
    });
    this.rule = h("span", { class: "keep-rule", "aria-live": "polite" });
    const pageStep = Math.max(1, Math.round(T / 10));
    this.slider.addEventListener("input", () => {
      this.set(Number(this.slider.value));
      onChange(this.index);
    });
    this.slider.addEventListener("keydown", (event) => {
      // Page Up/Down move a tenth of the range (the browser's own step there varies).
      if (event.key !== "PageUp" && event.key !== "PageDown") return;
      event.preventDefault();
      this.set(this.index + (event.key === "PageDown" ? pageStep : -pageStep));
      onChange(this.index);
    });
    this.typed.addEventListener("change", () => {
      const value = Number(this.typed.value);
      if (this.typed.value.trim() === "" || !Number.isFinite(value)) return;
      this.set(this.indexFor(value));
      onChange(this.index);
    });
    this.element = h(
      "section",
      { class: "panel threshold", "aria-labelledby": "threshold-title" },
      h("h2", { id: "threshold-title" }, "Threshold"),
      h("label", { class: "slider-row" }, this.slider),
      h(
        "div",
        { class: "typed-row" },
        h("label", { for: "threshold-value" }, "weight"),
        this.typed,
        this.rule,
      ),
    );
  }

  /** Moves to step `index` (clamped) without telling anyone. */
  set(index: number): void {
    const T = this.analysis.thresholds.length;
    this.index = Math.min(Math.max(0, Math.round(index)), Math.max(0, T - 1));
    this.slider.value = String(this.index);
    const threshold = this.threshold();
    this.typed.value = formatWeight(threshold);
    this.rule.textContent = `keeps ${keepRule(threshold, this.analysis.semantics)}`;
    this.slider.setAttribute("aria-valuetext", keepRule(threshold, this.analysis.semantics));
  }

  threshold(): number {
    const { thresholds, start } = this.analysis;
    return thresholds.length > 0 ? thresholds[this.index] : start;
  }

  /** The last step at or before a typed weight (the first step when the weight keeps no edge). */
  indexFor(weight: number): number {
    const { thresholds, semantics } = this.analysis;
    const f = toFiltrationValue(weight, semantics);
    let lo = 0;
    let hi = thresholds.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (toFiltrationValue(thresholds[mid], semantics) <= f) lo = mid + 1;
      else hi = mid;
    }
    return Math.max(0, lo - 1);
  }
}

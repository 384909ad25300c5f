import type { GraphAnalysis } from "../compute/graph-analysis.js";
import { h } from "../dom.js";
import { formatWeight } from "../format.js";

/**
 * The most persistent H1 bars as a keyboard-friendly list: Tab reaches it, arrow keys move between loops,
 * Enter or Space chooses one. Each item names the loop's nodes once they are known; "Copy" puts the chosen
 * loop's node labels on the clipboard.
 */
export class LoopList {
  readonly element: HTMLElement;
  readonly bars: number[];
  private readonly buttons = new Map<number, HTMLButtonElement>();
  private readonly nodes = new Map<number, HTMLElement>();
  private readonly copyButton: HTMLButtonElement;
  private readonly status: HTMLElement;
  private chosenLabels = "";

  constructor(analysis: GraphAnalysis, onChoose: (bar: number) => void) {
    this.bars = analysis.loopBars;
    const list = h("ol", { class: "loop-list", "aria-label": "Most persistent loops" });
    this.bars.forEach((bar, rank) => {
      const { birth, death } = analysis.bars[bar];
      const life = death === null ? "never filled" : `filled at ${formatWeight(death)}`;
      const names = h("span", { class: "loop-nodes" }, "…");
      const button = h(
        "button",
        { type: "button", class: "loop-item", "data-bar": bar, "aria-pressed": "false" },
        h("span", { class: "loop-head" }, `Loop ${rank + 1}: from ${formatWeight(birth)}, ${life}`),
        names,
      );
      button.addEventListener("click", () => onChoose(bar));
      button.addEventListener("keydown", (event) => {
        const step = event.key === "ArrowDown" ? 1 : event.key === "ArrowUp" ? -1 : 0;
        if (step === 0) return;
        event.preventDefault();
        const next = this.bars[rank + step];
        if (next !== undefined) this.buttons.get(next)?.focus();
      });
      this.buttons.set(bar, button);
      this.nodes.set(bar, names);
      list.append(h("li", {}, button));
    });
    this.copyButton = h("button", { type: "button", class: "small", disabled: true }, "Copy node labels");
    this.copyButton.addEventListener("click", () => this.copy());
    this.status = h("span", { class: "note", role: "status" });
    this.element = h(
      "section",
      { class: "panel loops-panel", "aria-labelledby": "loops-title" },
      h("h2", { id: "loops-title" }, "Loops (H1), longest-lived first"),
      this.bars.length > 0 ? list : h("p", { class: "note" }, "No loop: β1 is 0 at every threshold."),
      h("div", { class: "row" }, this.copyButton, this.status),
    );
  }

  /** Writes the node labels of a listed loop once the worker has found it. */
  name(bar: number, labels: string[]): void {
    const names = this.nodes.get(bar);
    if (names) names.textContent = labels.join(" – ");
  }

  /** Marks the chosen loop (or none) and remembers its labels for Copy. */
  choose(bar: number | null, labels: string[] = []): void {
    for (const [b, button] of this.buttons) button.setAttribute("aria-pressed", String(b === bar));
    this.chosenLabels = labels.join(", ");
    this.copyButton.disabled = labels.length === 0;
    this.status.textContent = "";
  }

  private async copy(): Promise<void> {
    try {
      await navigator.clipboard.writeText(this.chosenLabels);
      this.status.textContent = "copied";
    } catch {
      // No clipboard (a page opened from disk may not get one): show the text to copy by hand.
      this.status.textContent = this.chosenLabels;
    }
  }
}

import { AnalysisError } from "../compute/analysis-client.js";
import type { DropReadOptions } from "../compute/worker-protocol.js";
import { h } from "../dom.js";

/**
 * Opening a file in the page: drop it anywhere or pick it, with the reading choices a matrix may need.
 * The file is read in the worker by the same parsers as the command line, so a bad file gets the same
 * message, with its line and column.
 */
export class DropZone {
  readonly element: HTMLElement;
  private readonly error: HTMLElement;
  private readonly form: HTMLFormElement;

  constructor(onFile: (file: File, read: DropReadOptions) => Promise<void>) {
    const picker = h("input", { type: "file", id: "file-picker", accept: ".csv,.tsv,.txt,.npy" });
    this.form = h(
      "form",
      { class: "read-options" },
      select("semantics", "Weights", [
        ["similarity", "similarity: large = strong"],
        ["distance", "distance: small = close"],
      ]),
      h("label", {}, h("input", { type: "checkbox", name: "directed" }), " directed"),
      select("negative", "Negative weights", [
        ["error", "refuse"],
        ["abs", "absolute value"],
        ["drop", "drop the edge"],
        ["keep", "keep"],
      ]),
      select("symmetrize", "Asymmetric matrix", [
        ["error", "refuse"],
        ["max", "larger of the two"],
        ["min", "smaller"],
        ["mean", "mean"],
      ]),
    );
    this.error = h("div", { class: "drop-error", role: "alert", hidden: true });
    const open = async (file: File) => {
      this.error.hidden = true;
      try {
        await onFile(file, this.readOptions());
      } catch (error) {
        this.showError(error);
      }
    };
    picker.addEventListener("change", () => {
      if (picker.files?.[0]) void open(picker.files[0]);
    });
    this.element = h(
      "section",
      { class: "drop-zone", "aria-labelledby": "drop-title" },
      h("h2", { id: "drop-title" }, "Open a graph"),
      h(
        "p",
        {},
        "Drop a matrix (CSV, TSV, whitespace text), an edge list with a source,target[,weight] header, or a NumPy .npy file anywhere on this page, or ",
        h("label", { for: "file-picker", class: "link" }, "choose one"),
        ". Nothing leaves your computer: it is read and analysed in this page.",
      ),
      picker,
      this.form,
      this.error,
    );
    document.addEventListener("dragover", (event) => {
      event.preventDefault();
      document.body.classList.add("dragging");
    });
    document.addEventListener("dragleave", () => document.body.classList.remove("dragging"));
    document.addEventListener("drop", (event) => {
      event.preventDefault();
      document.body.classList.remove("dragging");
      const file = event.dataTransfer?.files[0];
      if (file) void open(file);
    });
  }

  readOptions(): DropReadOptions {
    const data = new FormData(this.form);
    return {
      semantics: data.get("semantics") as DropReadOptions["semantics"],
      directed: data.get("directed") === "on",
      negative: data.get("negative") as DropReadOptions["negative"],
      symmetrize: data.get("symmetrize") as DropReadOptions["symmetrize"],
    };
  }

  /** Shows a reader's error: its message as the command line prints it, and where to look. */
  showError(error: unknown): void {
    const detail = error instanceof AnalysisError ? error.detail : undefined;
    const where =
      detail?.line !== undefined
        ? `line ${detail.line}${detail.column !== undefined ? `, column ${detail.column}` : ""}`
        : "";
    this.error.replaceChildren(
      h("strong", {}, where ? `Cannot read the file (${where})` : "Cannot read the file"),
      h("pre", {}, error instanceof Error ? error.message : String(error)),
    );
    this.error.hidden = false;
    // A file dropped on a graph or run page: show the zone (and its message) above that page.
    if (!this.element.isConnected) document.getElementById("app")?.prepend(this.element);
  }
}

function select(name: string, label: string, options: [string, string][]): HTMLElement {
  return h(
    "label",
    {},
    `${label} `,
    h("select", { name }, ...options.map(([value, text]) => h("option", { value }, text))),
  );
}

import { h } from "../dom.js";
import type { RunFolder } from "./run-folder.js";

/** Headline columns of the table, when the run has them: [feature column, heading]. */
const HEADLINES: [string, string][] = [
  ["net_nodes", "nodes"],
  ["net_edges", "edges"],
  ["net_density", "density"],
  ["betti_d1_max", "β1 max"],
  ["betti_d1_area", "β1 area"],
  ["euler_area", "χ area"],
  ["bars_d1_total_persistence", "H1 total persistence"],
  ["bars_d1_max_persistence", "H1 longest bar"],
];

type SortKey = "id" | "label" | "split" | number;

/**
 * The graphs of a run as a sortable table: id, label, split and headline features. A header sorts (again:
 * the other way); an id opens that graph.
 */
export function runTable(
  run: RunFolder,
  canOpen: (id: string) => boolean,
  onOpen: (id: string) => void,
): HTMLElement {
  const columns = HEADLINES.flatMap(([name, heading]) => {
    const index = run.featureNames.indexOf(name);
    return index >= 0 ? [{ index, heading }] : [];
  });
  const order = run.graphs.map((_, i) => i);
  let sortKey: SortKey = "id";
  let ascending = true;
  const tbody = h("tbody");
  const headers: HTMLElement[] = [];

  const value = (row: number, key: SortKey): string | number => {
    const g = run.graphs[row];
    return typeof key === "number" ? g.values[key] : g[key];
  };
  const render = () => {
    order.sort((a, b) => {
      const x = value(a, sortKey);
      const y = value(b, sortKey);
      const c =
        typeof x === "number" && typeof y === "number"
          ? x - y
          : String(x).localeCompare(String(y), undefined, { numeric: true });
      return (ascending ? c : -c) || a - b;
    });
    tbody.replaceChildren(
      ...order.map((row) => {
        const g = run.graphs[row];
        const open = canOpen(g.id)
          ? h("button", { type: "button", class: "link", "data-open": g.id }, g.id)
          : h("span", { title: "no graph to show for this id" }, g.id);
        open.addEventListener("click", () => onOpen(g.id));
        return h(
          "tr",
          {},
          h("th", { scope: "row" }, open),
          h("td", {}, g.label),
          h("td", {}, g.split),
          ...columns.map((c) => h("td", { class: "num" }, formatCell(g.values[c.index]))),
          h("td", {}, g.truncated ? "partial" : ""),
        );
      }),
    );
  };
  const header = (key: SortKey, heading: string) => {
    const th = h("th", { scope: "col", "aria-sort": key === sortKey ? "ascending" : "none" });
    const sortButton = h("button", { type: "button", class: "sort" }, heading);
    sortButton.addEventListener("click", () => {
      ascending = key === sortKey ? !ascending : true;
      sortKey = key;
      for (const other of headers) other.setAttribute("aria-sort", "none");
      th.setAttribute("aria-sort", ascending ? "ascending" : "descending");
      render();
    });
    th.append(sortButton);
    headers.push(th);
    return th;
  };
  render();
  return h(
    "table",
    { class: "run-table" },
    h(
      "thead",
      {},
      h(
        "tr",
        {},
        header("id", "id"),
        header("label", "label"),
        header("split", "split"),
        ...columns.map((c) => header(c.index, c.heading)),
        h(
          "th",
          { scope: "col", title: "partial: the top dimension hid simplices, Euler columns are partial sums" },
          "χ",
        ),
      ),
    ),
    tbody,
  );
}

function formatCell(x: number): string {
  if (!Number.isFinite(x)) return "–";
  if (Number.isInteger(x)) return String(x);
  return Math.abs(x) >= 100 ? x.toFixed(1) : x.toPrecision(3);
}

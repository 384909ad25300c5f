import { chartSvg } from "../charts/chart-host.js";
import { h } from "../dom.js";
import { download } from "../export/download.js";
import { formatWeight } from "../format.js";
import type { RunSession } from "../session/page-session.js";
import { featureMap } from "./feature-map.js";
import { featureMapChart } from "./feature-map-chart.js";
import { labelCurves } from "./label-curves.js";
import { LabelCurvesChart } from "./label-curves-chart.js";
import { type RunFolder, readRunFolder, runCurves } from "./run-folder.js";
import { runTable } from "./run-table.js";

/** How a curve's column prefix reads on the page. */
function curveTitle(curve: string): string {
  const dim = curve.match(/_d(\d+)$/)?.[1];
  if (curve.startsWith("betti_")) return `β${dim} (Betti number)`;
  if (curve.startsWith("simplices_")) return `${dim}-simplices`;
  return "χ (Euler characteristic)";
}

/**
 * A run folder at a glance: the graphs in a sortable table, each label's mean curves with their spread, and
 * a PCA map of the feature table. A row's id or a point opens that graph.
 */
export function showRunPage(root: HTMLElement, session: RunSession, onOpen: (id: string) => void): RunFolder {
  const run = readRunFolder(session.files);
  const openable = new Set(session.graphIds);
  const { axis, weights, topDim, prime } = run.settings;
  const grid =
    axis.kind === "weight"
      ? `${axis.values.length} ${weights} thresholds ${formatWeight(axis.values[0])} … ${formatWeight(axis.values[axis.values.length - 1])}`
      : `${axis.values.length} edge densities ${axis.values[0]} … ${axis.values[axis.values.length - 1]}`;

  const curveSelect = h(
    "select",
    { id: "curve-choice", "aria-label": "Curve" },
    ...runCurves(run).map((c) => h("option", { value: c }, curveTitle(c))),
  );
  const curvesBody = h("div", { class: "chart tall", id: "label-curves-chart" });
  const mapBody = h("div", { class: "chart tall", id: "feature-map-chart" });
  const saveCurves = h("button", { type: "button", class: "small" }, "SVG");
  const saveMap = h("button", { type: "button", class: "small" }, "SVG");
  const map = featureMap(run);
  const mapCaption = h(
    "figcaption",
    {},
    map
      ? `Feature map: first two principal components of ${map.columns} standardised features `
      : "Feature map ",
    saveMap,
  );
  const errors =
    run.errors.length === 0
      ? []
      : [
          h(
            "section",
            { class: "panel" },
            h("h2", {}, `Left out (${run.errors.length})`),
            h(
              "ul",
              { class: "errors" },
              ...run.errors.map((e) =>
                h("li", {}, `${e.id}: ${e.file}${e.line ? `:${e.line}` : ""}: ${e.reason}`),
              ),
            ),
          ),
        ];
  const tablePanel = h(
    "section",
    { class: "panel table-panel", "aria-labelledby": "graphs-title" },
    h("h2", { id: "graphs-title" }, "Graphs"),
  );
  root.replaceChildren(
    h(
      "div",
      { class: "run-page" },
      h(
        "header",
        { class: "run-head" },
        h("h1", {}, `Run ${session.name}`),
        h(
          "p",
          {},
          `${run.graphs.length} graphs · ${run.settings.labelNames.length} labels · ${grid} · simplices to dimension ${topDim} · homology over Z/${prime}${run.settings.toolVersion ? ` · cliquescape ${run.settings.toolVersion}` : ""}`,
        ),
        session.graphNote ? h("p", { class: "note" }, session.graphNote) : "",
      ),
      h(
        "div",
        { class: "run-charts" },
        h(
          "figure",
          { class: "panel chart-panel" },
          h("figcaption", {}, "Curves by label: mean ± 1 sd ", curveSelect, saveCurves),
          curvesBody,
        ),
        h("figure", { class: "panel chart-panel" }, mapCaption, mapBody),
      ),
      tablePanel,
      ...errors,
    ),
  );

  const curvesChart = new LabelCurvesChart(curvesBody, run);
  const showCurve = () => curvesChart.show(labelCurves(run, curveSelect.value));
  curveSelect.value = runCurves(run).includes("betti_d1") ? "betti_d1" : curveSelect.value;
  curveSelect.addEventListener("change", showCurve);
  showCurve();
  saveCurves.addEventListener("click", () =>
    download(`${curveSelect.value}-by-label.svg`, chartSvg(curvesChart.chart), "image/svg+xml"),
  );

  if (map) {
    const chart = featureMapChart(mapBody, run, map, (id) => {
      if (openable.has(id)) onOpen(id);
    });
    saveMap.addEventListener("click", () => download("feature-map.svg", chartSvg(chart), "image/svg+xml"));
  } else {
    mapBody.replaceChildren(h("p", { class: "note" }, "Too few graphs or varying features for a map."));
  }
  // The table goes in last: the charts measure their boxes as they start, and each measurement lays out
  // the page, which with a thousand rows in it took about 0.2 s.
  tablePanel.append(runTable(run, (id) => openable.has(id), onOpen));
  return run;
}

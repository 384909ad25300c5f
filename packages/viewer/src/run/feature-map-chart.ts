import type { EChartsType } from "echarts/core";
import { CHART_TEXT, createChart } from "../charts/chart-host.js";
import { PALETTE, seriesColour } from "../palette.js";
import type { FeatureMap } from "./feature-map.js";
import type { RunFolder } from "./run-folder.js";

const SHAPES = ["circle", "triangle", "diamond", "rect", "roundRect", "pin", "arrow"];

/** The PCA map of the feature table, one point per graph, coloured and shaped by label; a click opens it. */
export function featureMapChart(
  element: HTMLElement,
  run: RunFolder,
  map: FeatureMap,
  onOpen: (id: string) => void,
): EChartsType {
  const chart = createChart(element);
  const series = run.settings.labelNames.map((label, i) => ({
    name: label,
    type: "scatter",
    symbol: SHAPES[i % SHAPES.length],
    symbolSize: 9,
    color: seriesColour(i),
    data: run.graphs.flatMap((g, row) => (g.label === label ? [{ value: map.points[row], name: g.id }] : [])),
  }));
  const percent = (x: number) => `${(100 * x).toFixed(0)} %`;
  chart.setOption({
    textStyle: CHART_TEXT,
    animation: false,
    legend: { top: 0, textStyle: CHART_TEXT },
    tooltip: {
      trigger: "item",
      formatter: (p: { name: string; seriesName: string }) => `${p.name} (${p.seriesName}): click to open`,
    },
    grid: { left: 52, right: 20, top: 32, bottom: 42 },
    xAxis: {
      type: "value",
      name: `PC1 (${percent(map.explained[0])} of variance)`,
      nameLocation: "middle",
      nameGap: 26,
      scale: true,
      splitLine: { lineStyle: { color: PALETTE.rule } },
    },
    yAxis: {
      type: "value",
      name: `PC2 (${percent(map.explained[1])})`,
      nameLocation: "middle",
      nameGap: 36,
      scale: true,
      splitLine: { lineStyle: { color: PALETTE.rule } },
    },
    series,
  });
  chart.on("click", (params) => {
    if (params.name) onOpen(params.name);
  });
  return chart;
}

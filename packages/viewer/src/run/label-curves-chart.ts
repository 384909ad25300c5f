import type { EChartsType } from "echarts/core";
import { CHART_TEXT, createChart, weightAxis } from "../charts/chart-host.js";
import { formatWeight } from "../format.js";
import { PALETTE, seriesColour } from "../palette.js";
import type { LabelCurve } from "./label-curves.js";
import type { RunFolder } from "./run-folder.js";

/** Mean curve per label with a band of ± one standard deviation, on the run's grid. */
export class LabelCurvesChart {
  readonly chart: EChartsType;
  private readonly run: RunFolder;

  constructor(element: HTMLElement, run: RunFolder) {
    this.chart = createChart(element);
    this.run = run;
  }

  show(curves: LabelCurve[]): void {
    const { axis, weights } = this.run.settings;
    const x = axis.values;
    const series: Record<string, unknown>[] = [];
    curves.forEach((c, i) => {
      const colour = seriesColour(i);
      const stack = `band-${i}`;
      series.push({
        id: `mean-${c.label}`,
        name: c.label,
        type: "line",
        symbol: "circle",
        symbolSize: 4,
        color: colour,
        lineStyle: { width: 2 },
        data: x.map((v, t) => [v, c.mean[t]]),
      });
      // The band: an invisible lower edge, then the band's height stacked on it and filled.
      const band = (values: number[], extra: Record<string, unknown> = {}) => ({
        name: c.label,
        type: "line",
        stack,
        symbol: "none",
        lineStyle: { opacity: 0 },
        data: x.map((v, t) => [v, values[t]]),
        tooltip: { show: false },
        silent: true,
        ...extra,
      });
      series.push(band(c.mean.map((m, t) => m - c.sd[t])));
      series.push(
        band(
          c.sd.map((s) => 2 * s),
          { areaStyle: { color: colour, opacity: 0.18 } },
        ),
      );
    });
    this.chart.setOption(
      {
        textStyle: CHART_TEXT,
        animation: false,
        legend: { top: 0, textStyle: CHART_TEXT, data: curves.map((c) => c.label) },
        tooltip: {
          trigger: "axis",
          valueFormatter: (v: number) => (Number.isFinite(v) ? v.toFixed(2) : "–"),
        },
        grid: { left: 52, right: 20, top: 32, bottom: 42 },
        xAxis:
          axis.kind === "density"
            ? { type: "value", name: "edge density", nameLocation: "middle", nameGap: 26, scale: true }
            : weightAxis("threshold (weight)", weights === "similarity", {
                min: Math.min(...x),
                max: Math.max(...x),
                axisLabel: { formatter: formatWeight },
              }),
        yAxis: { type: "value", scale: true, splitLine: { lineStyle: { color: PALETTE.rule } } },
        series,
      },
      { notMerge: true },
    );
  }
}

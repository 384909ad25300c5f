import type { EChartsType } from "echarts/core";
import type { GraphAnalysis } from "../compute/graph-analysis.js";
import { formatWeight } from "../format.js";
import { EULER_COLOUR, PALETTE, seriesColour } from "../palette.js";
import { CHART_TEXT, createChart, weightAxis } from "./chart-host.js";

/** At most this many points per curve; the curves are step functions of the threshold. */
const MAX_POINTS = 600;

/**
 * Betti curves (β_k against the threshold, left axis) and the Euler characteristic (dashed, right axis),
 * with a marker at the current threshold. Values come from the analysis at every distinct edge value.
 */
export class CurvesChart {
  readonly chart: EChartsType;

  constructor(element: HTMLElement, analysis: GraphAnalysis) {
    this.chart = createChart(element);
    const { thresholds, bettiDims, betti, euler } = analysis;
    const T = thresholds.length;
    const picks =
      T <= MAX_POINTS
        ? [...Array(T).keys()]
        : Array.from({ length: MAX_POINTS }, (_, i) => Math.round((i * (T - 1)) / (MAX_POINTS - 1)));
    const series: Record<string, unknown>[] = [];
    for (let k = 0; k < bettiDims; k++) {
      series.push({
        id: `betti${k}`,
        name: `β${k}`,
        type: "line",
        step: "end",
        showSymbol: false,
        color: seriesColour(k),
        lineStyle: { width: 2 },
        data: picks.map((t) => [thresholds[t], betti[t * bettiDims + k]]),
      });
    }
    series.push({
      id: "euler",
      name: "χ (right axis)",
      type: "line",
      step: "end",
      yAxisIndex: 1,
      showSymbol: false,
      color: EULER_COLOUR,
      lineStyle: { width: 1.5, type: "dashed" },
      data: picks.map((t) => [thresholds[t], euler[t]]),
    });
    this.chart.setOption({
      textStyle: CHART_TEXT,
      animation: false,
      legend: { top: 0, textStyle: CHART_TEXT },
      tooltip: { trigger: "axis", valueFormatter: (v: number) => String(v) },
      grid: { left: 44, right: 48, top: 30, bottom: 40 },
      xAxis: weightAxis("threshold (weight)", analysis.semantics === "similarity", {
        axisLabel: { formatter: formatWeight },
      }),
      yAxis: [
        { type: "value", minInterval: 1, splitLine: { lineStyle: { color: PALETTE.rule } } },
        { type: "value", splitLine: { show: false } },
      ],
      series,
    });
  }

  /** Moves the marker to the current threshold. */
  mark(threshold: number): void {
    this.chart.setOption({
      series: [
        {
          id: "betti0",
          markLine: {
            silent: true,
            symbol: "none",
            animation: false,
            label: { formatter: formatWeight(threshold), color: PALETTE.accent },
            lineStyle: { color: PALETTE.accent, width: 1.5, type: "solid" },
            data: [{ xAxis: threshold }],
          },
        },
      ],
    });
  }
}

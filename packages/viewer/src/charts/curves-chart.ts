import type { EChartsType } from "echarts/core";
import type { GraphAnalysis } from "../compute/graph-analysis.js";
import { formatWeight } from "../format.js";
import { EULER_COLOUR, PALETTE, seriesColour } from "../palette.js";
import { CHART_TEXT, chartSvg, createChart, weightAxis } from "./chart-host.js";
import { echarts } from "./echarts-setup.js";

/** At most this many points per curve; the curves are step functions of the threshold. */
const MAX_POINTS = 600;
/** The plot area's margins (px), shared by the option and the marker drawn over it. */
const GRID = { left: 44, right: 48, top: 30, bottom: 40 };

/**
 * Betti curves (β_k against the threshold, left axis) and the Euler characteristic (dashed, right axis),
 * with a marker at the current threshold. Values come from the analysis at every distinct edge value.
 */
export class CurvesChart {
  readonly chart: EChartsType;
  /**
   * The marker, drawn straight into the chart's drawing on a layer of its own: a `setOption` (a markLine)
   * re-rendered every curve on each slider move, about a third of the move's CPU time on a large graph.
   * The saved SVG draws it as a markLine.
   */
  private readonly markerLine = new echarts.graphic.Line({
    shape: { x1: 0, y1: 0, x2: 0, y2: 0 },
    style: { stroke: PALETTE.accent, lineWidth: 1.5 },
    silent: true,
    invisible: true,
    zlevel: 1,
  });
  private readonly markerLabel = new echarts.graphic.Text({
    style: {
      text: "",
      fill: PALETTE.accent,
      fontSize: CHART_TEXT.fontSize,
      fontFamily: CHART_TEXT.fontFamily,
      align: "center",
      verticalAlign: "bottom",
    },
    silent: true,
    invisible: true,
    zlevel: 1,
  });
  private marked: number | null = null;

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
      grid: GRID,
      xAxis: weightAxis("threshold (weight)", analysis.semantics === "similarity", {
        axisLabel: { formatter: formatWeight },
      }),
      yAxis: [
        { type: "value", minInterval: 1, splitLine: { lineStyle: { color: PALETTE.rule } } },
        { type: "value", splitLine: { show: false } },
      ],
      series,
    });
    this.chart.getZr().add(this.markerLine);
    this.chart.getZr().add(this.markerLabel);
    // A resize redraws the axes: the marker follows.
    this.chart.on("finished", () => this.placeMarker());
  }

  /** Moves the marker to the current threshold. */
  mark(threshold: number): void {
    this.marked = threshold;
    this.placeMarker();
  }

  /** The chart as SVG, the marker drawn as on screen. */
  svg(): string {
    if (this.marked === null) return chartSvg(this.chart);
    return chartSvg(this.chart, {
      series: [
        {
          id: "betti0",
          markLine: {
            silent: true,
            symbol: "none",
            animation: false,
            label: { formatter: formatWeight(this.marked), color: PALETTE.accent },
            lineStyle: { color: PALETTE.accent, width: 1.5, type: "solid" },
            data: [{ xAxis: this.marked }],
          },
        },
      ],
    });
  }

  private placeMarker(): void {
    if (this.marked === null) return;
    const x = this.chart.convertToPixel({ xAxisIndex: 0 }, this.marked) as number;
    const top = GRID.top;
    const bottom = this.chart.getHeight() - GRID.bottom;
    const inside = Number.isFinite(x) && x >= GRID.left && x <= this.chart.getWidth() - GRID.right;
    this.markerLine.attr({ invisible: !inside, shape: { x1: x, y1: bottom, x2: x, y2: top } });
    // As a markLine's label: at the line's upper end, 5 px above it.
    this.markerLabel.attr({ invisible: !inside, x, y: top - 5, style: { text: formatWeight(this.marked) } });
  }
}

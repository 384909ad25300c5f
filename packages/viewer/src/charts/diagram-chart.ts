import type { EChartsType } from "echarts";
import type { GraphAnalysis } from "../compute/graph-analysis.js";
import { formatWeight } from "../format.js";
import { PALETTE, seriesColour } from "../palette.js";
import { barChartBase, filtrationEnd } from "./bar-charts.js";
import { chartSvg, createChart, weightAxis } from "./chart-host.js";
import { echarts } from "./echarts-setup.js";

// [birth, death (or the "never dies" line), bar number, essential (1/0)].
type PointDatum = [number, number, number, number];

/**
 * The persistence diagram: a point (birth, death) per bar, the diagonal birth = death, and bars that never
 * die on a line above the end of the filtration. Points far from the diagonal last long. Clicking one
 * chooses its bar.
 */
export class DiagramChart {
  readonly chart: EChartsType;
  private readonly points: Map<number, PointDatum> = new Map();
  /**
   * The chosen point on screen: a circle added to the chart's drawing directly, on a layer of its own. Any
   * `setOption` re-renders every series, and repainting tens of thousands of points took about 0.5 s of
   * CPU per choice; the option's "chosen" series is filled only in the saved SVG.
   */
  private readonly marker = new echarts.graphic.Circle({
    shape: { cx: 0, cy: 0, r: 7 },
    style: { fill: PALETTE.loop },
    silent: true,
    invisible: true,
    zlevel: 1,
    z: 5,
  });
  private chosen: PointDatum | undefined;

  constructor(element: HTMLElement, analysis: GraphAnalysis, onChoose: (bar: number) => void) {
    this.chart = createChart(element);
    const similarity = analysis.semantics === "similarity";
    const start = analysis.start;
    const end = filtrationEnd(analysis);
    // The "never dies" line sits a little past the end of the filtration.
    const never = end + (end - start) * 0.08 || end + 1;
    const dims = Math.max(0, ...analysis.bars.map((b) => b.dim)) + 1;
    const series: Record<string, unknown>[] = [];
    for (let k = 0; k < dims; k++) {
      const data: PointDatum[] = [];
      analysis.bars.forEach((bar, i) => {
        if (bar.dim !== k) return;
        const point: PointDatum = [bar.birth, bar.death ?? never, i, bar.death === null ? 1 : 0];
        data.push(point);
        this.points.set(i, point);
      });
      series.push({
        id: `dim${k}`,
        name: `H${k}`,
        type: "scatter",
        symbol: ["circle", "triangle", "diamond", "rect"][k % 4],
        symbolSize: 7,
        color: seriesColour(k),
        itemStyle: { opacity: 0.85 },
        // Thousands of points: ECharts' batched drawing.
        large: data.length > 2000,
        data,
      });
    }
    const lo = Math.min(start, end, never);
    const hi = Math.max(start, end, never);
    series.push({
      id: "guides",
      type: "line",
      data: [],
      silent: true,
      markLine: {
        silent: true,
        symbol: "none",
        animation: false,
        lineStyle: { color: PALETTE.muted, type: "dotted" },
        label: { show: true, position: "insideEndTop", color: PALETTE.muted, formatter: "{b}" },
        data: [
          [{ name: "birth = death", coord: [lo, lo] }, { coord: [hi, hi] }],
          { name: "never dies", yAxis: never },
        ],
      },
    });
    series.push({ id: "chosen", type: "scatter", symbolSize: 14, color: PALETTE.loop, data: [], z: 5 });
    // The end of the axis past the filtration is the "never dies" line, not a weight.
    const label = (v: number) => (v === never ? "never" : formatWeight(v));
    const axis = (name: string) =>
      weightAxis(name, similarity, { min: lo, max: hi, scale: false, axisLabel: { formatter: label } });
    this.chart.setOption({
      ...barChartBase(analysis, dims, (datum) => datum[2]),
      grid: { left: 52, right: 20, top: 30, bottom: 40 },
      xAxis: axis("birth"),
      yAxis: { ...axis("death"), nameGap: 38 },
      series,
    });
    this.chart.on("click", (params) => {
      const datum = params.data as PointDatum | undefined;
      if (datum && params.seriesId !== "chosen") onChoose(datum[2]);
    });
    this.chart.getZr().add(this.marker);
    // A resize redraws the axes: the marker follows.
    this.chart.on("finished", () => this.placeMarker());
  }

  choose(bar: number | null): void {
    this.chosen = bar === null ? undefined : this.points.get(bar);
    this.placeMarker();
  }

  /** The chart as SVG, the chosen point drawn as on screen. */
  svg(): string {
    return chartSvg(this.chart, { series: [{ id: "chosen", data: this.chosen ? [this.chosen] : [] }] });
  }

  private placeMarker(): void {
    if (!this.chosen) {
      this.marker.attr({ invisible: true });
      return;
    }
    const [cx, cy] = this.chart.convertToPixel({ xAxisIndex: 0, yAxisIndex: 0 }, [
      this.chosen[0],
      this.chosen[1],
    ]);
    this.marker.attr({ invisible: false, shape: { cx, cy } });
  }
}

import type { CustomSeriesRenderItem, EChartsType } from "echarts";
import type { GraphAnalysis } from "../compute/graph-analysis.js";
import { formatWeight } from "../format.js";
import { PALETTE, seriesColour } from "../palette.js";
import { barChartBase, filtrationEnd } from "./bar-charts.js";
import { CHART_TEXT, createChart, weightAxis } from "./chart-host.js";
import { echarts } from "./echarts-setup.js";

// One bar per row: [from, to, row, bar number, essential (1/0)].
type BarDatum = [number, number, number, number, number];

const drawBar: CustomSeriesRenderItem = (params, api) => {
  const from = api.coord([api.value(0), api.value(2)]);
  const to = api.coord([api.value(1), api.value(2)]);
  const height = Math.max(1.5, Math.min(8, ((api.size?.([0, 1]) as number[] | undefined)?.[1] ?? 4) * 0.7));
  const shape = echarts.graphic.clipRectByRect(
    {
      x: Math.min(from[0], to[0]),
      y: from[1] - height / 2,
      width: Math.max(1, Math.abs(to[0] - from[0])),
      height,
    },
    params.coordSys as unknown as { x: number; y: number; width: number; height: number },
  );
  return shape && { type: "rect", shape, style: api.style() };
};

/** Bars drawn per dimension: the longest ones; hundreds more would be thinner than a pixel. */
export const BARS_PER_DIMENSION = 300;

/**
 * The barcode: one horizontal bar per class, from its birth to its death (to the end of the filtration
 * when it never dies), grouped by dimension, β0 at the top, each group ordered by birth. A dimension with
 * more than BARS_PER_DIMENSION bars shows its longest ones, and the chart says so. Clicking a bar chooses it.
 */
export class BarcodeChart {
  readonly chart: EChartsType;
  private readonly rows: Map<number, BarDatum>;

  constructor(element: HTMLElement, analysis: GraphAnalysis, onChoose: (bar: number) => void) {
    this.chart = createChart(element);
    const end = filtrationEnd(analysis);
    const dims = Math.max(0, ...analysis.bars.map((b) => b.dim)) + 1;
    this.rows = new Map();
    let row = 0;
    const notes: string[] = [];
    const series: Record<string, unknown>[] = [];
    const length = (i: number) => {
      const { birth, death } = analysis.bars[i];
      return death === null ? Infinity : Math.abs(death - birth);
    };
    for (let k = 0; k < dims; k++) {
      const data: BarDatum[] = [];
      const all = analysis.bars.flatMap((bar, i) => (bar.dim === k ? [i] : []));
      const shown =
        all.length <= BARS_PER_DIMENSION
          ? all
          : all
              .sort((x, y) => length(y) - length(x) || x - y)
              .slice(0, BARS_PER_DIMENSION)
              .sort((x, y) => x - y);
      if (shown.length < all.length) notes.push(`H${k}: longest ${shown.length} of ${all.length}`);
      for (const i of shown) {
        const bar = analysis.bars[i];
        const datum: BarDatum = [bar.birth, bar.death ?? end, row++, i, bar.death === null ? 1 : 0];
        data.push(datum);
        this.rows.set(i, datum);
      }
      series.push({
        id: `dim${k}`,
        name: `H${k}`,
        type: "custom",
        renderItem: drawBar,
        color: seriesColour(k),
        encode: { x: [0, 1], y: 2 },
        data,
      });
    }
    series.push({
      id: "chosen",
      name: "chosen",
      type: "custom",
      renderItem: drawBar,
      color: PALETTE.loop,
      encode: { x: [0, 1], y: 2 },
      data: [],
    });
    this.chart.setOption({
      ...barChartBase(analysis, dims, (datum) => datum[3]),
      grid: { left: 16, right: 16, top: 30, bottom: 40 },
      xAxis: weightAxis("threshold (weight)", analysis.semantics === "similarity", {
        axisLabel: { formatter: formatWeight },
      }),
      yAxis: { type: "value", inverse: true, min: -0.5, max: Math.max(row, 1) - 0.5, show: false },
      title: {
        text: notes.join(" · "),
        right: 4,
        bottom: 0,
        textStyle: { ...CHART_TEXT, fontSize: 10, fontWeight: "normal" },
      },
      series,
    });
    this.chart.on("click", (params) => {
      const datum = params.data as BarDatum | undefined;
      if (datum) onChoose(datum[3]);
    });
  }

  /** Draws the chosen bar in the loop colour (null: none). */
  choose(bar: number | null): void {
    const datum = bar === null ? undefined : this.rows.get(bar);
    this.chart.setOption({ series: [{ id: "chosen", data: datum ? [datum] : [] }] });
  }
}

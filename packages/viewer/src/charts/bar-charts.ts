import type { GraphAnalysis } from "../compute/graph-analysis.js";
import { formatWeight } from "../format.js";
import { CHART_TEXT } from "./chart-host.js";

/** Where bars that never die are drawn to: the last edge value (the end of the filtration). */
export function filtrationEnd(analysis: GraphAnalysis): number {
  const { thresholds, start } = analysis;
  return thresholds.length > 0 ? thresholds[thresholds.length - 1] : start;
}

/** "H1 bar 46: born 0.536, never dies": a bar as the charts' tooltips name it. */
export function describeBar(analysis: GraphAnalysis, bar: number): string {
  const { dim, birth, death } = analysis.bars[bar];
  return `H${dim} bar ${bar}: born ${formatWeight(birth)}, ${death === null ? "never dies" : `dies ${formatWeight(death)}`}`;
}

/** What the barcode and the diagram share: text, a legend of their dimensions, a tooltip naming the bar. */
export function barChartBase(analysis: GraphAnalysis, dims: number, barOf: (datum: number[]) => number) {
  return {
    textStyle: CHART_TEXT,
    animation: false,
    legend: { top: 0, textStyle: CHART_TEXT, data: Array.from({ length: dims }, (_, k) => `H${k}`) },
    tooltip: { trigger: "item", formatter: (p: { data: number[] }) => describeBar(analysis, barOf(p.data)) },
  };
}

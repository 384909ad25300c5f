import type { EChartsType } from "echarts/core";
import { PALETTE } from "../palette.js";
import { echarts } from "./echarts-setup.js";

/** The text style every chart shares: the page's ink on white, readable at 1280 × 800. */
export const CHART_TEXT = { color: PALETTE.ink, fontFamily: "system-ui, sans-serif", fontSize: 12 };

/** An ECharts chart in an element, drawn on a canvas and resized with its element. */
export function createChart(element: HTMLElement): EChartsType {
  const chart = echarts.init(element, null, { renderer: "canvas" });
  new ResizeObserver(() => chart.resize()).observe(element);
  return chart;
}

/**
 * The chart as a standalone SVG document, for saving: the same option, drawn by ECharts' SVG renderer, with
 * `extra` merged in (what the chart draws on screen outside its option).
 */
export function chartSvg(chart: EChartsType, extra?: Record<string, unknown>): string {
  const box = document.createElement("div");
  box.style.cssText = `position: absolute; left: -100000px; width: ${chart.getWidth()}px; height: ${chart.getHeight()}px`;
  document.body.append(box);
  const copy = echarts.init(box, null, {
    renderer: "svg",
    width: chart.getWidth(),
    height: chart.getHeight(),
  });
  try {
    copy.setOption({ ...chart.getOption(), animation: false });
    if (extra) copy.setOption(extra);
    return copy.renderToSVGString();
  } finally {
    copy.dispose();
    box.remove();
  }
}

/** A value axis over weights: thresholds run from strong to weak left to right, whatever the weights mean. */
export function weightAxis(name: string, similarity: boolean, extra: Record<string, unknown> = {}) {
  return {
    type: "value" as const,
    name,
    nameLocation: "middle" as const,
    nameGap: 26,
    inverse: similarity,
    scale: true,
    axisLine: { lineStyle: { color: PALETTE.muted } },
    splitLine: { lineStyle: { color: PALETTE.rule, opacity: 0.6 } },
    ...extra,
  };
}

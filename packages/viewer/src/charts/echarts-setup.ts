import { CustomChart, LineChart, ScatterChart } from "echarts/charts";
import {
  GridComponent,
  LegendComponent,
  MarkLineComponent,
  TitleComponent,
  TooltipComponent,
} from "echarts/components";
import * as echarts from "echarts/core";
import { CanvasRenderer, SVGRenderer } from "echarts/renderers";

// Only what the page draws: lines, scatter and custom (barcode) series. On screen a canvas (tens of
// thousands of bars and points stay fast); saved as SVG by drawing the same option again with the SVG renderer.
echarts.use([
  LineChart,
  ScatterChart,
  CustomChart,
  GridComponent,
  LegendComponent,
  MarkLineComponent,
  TitleComponent,
  TooltipComponent,
  CanvasRenderer,
  SVGRenderer,
]);

export { echarts };

import { CustomChart, LineChart, ScatterChart } from "echarts/charts";
import {
  GridComponent,
  LegendComponent,
  MarkLineComponent,
  TitleComponent,
  TooltipComponent,
} from "echarts/components";
import * as echarts from "echarts/core";
import { SVGRenderer } from "echarts/renderers";

// Only what the page draws: lines, scatter and custom (barcode) series, rendered as SVG so every chart can
// be saved as an SVG file exactly as shown.
echarts.use([
  LineChart,
  ScatterChart,
  CustomChart,
  GridComponent,
  LegendComponent,
  MarkLineComponent,
  TitleComponent,
  TooltipComponent,
  SVGRenderer,
]);

export { echarts };

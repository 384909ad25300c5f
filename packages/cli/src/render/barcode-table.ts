import type { BarcodeReport } from "../commands/barcode.js";
import { formatWeight } from "./format-number.js";
import { textTable } from "./text-table.js";

const PICTURE_WIDTH = 40;
const SHOWN_PER_DIMENSION = 15;

/**
 * The barcode for a terminal: per dimension, the most persistent bars with their numbers (for --bar), and
 * each bar drawn on one shared axis running the way edges enter (left: first edge, right: last).
 */
export function renderBarcodeTable(report: BarcodeReport): string {
  const sign = report.weights === "distance" ? 1 : -1;
  const finite = report.bars.flatMap((b) => (b.death === null ? [b.birth] : [b.birth, b.death]));
  const from = sign * report.start;
  const to = finite.reduce((most, w) => Math.max(most, sign * w), Math.max(from, sign * report.end));
  const column = (w: number) => Math.round(((sign * w - from) / (to - from || 1)) * (PICTURE_WIDTH - 1));
  const draw = (birth: number, death: number | null) => {
    const a = column(birth);
    const b = death === null ? PICTURE_WIDTH : Math.max(a + 1, column(death));
    return `${" ".repeat(a)}${"█".repeat(b - a)}${death === null ? "▶" : ""}`;
  };
  const sections: string[] = [];
  const dims = [...new Set(report.bars.map((b) => b.dim))].sort((a, b) => a - b);
  for (const dim of dims) {
    const indices = report.bars.flatMap((b, i) => (b.dim === dim ? [i] : []));
    const length = (i: number) => {
      const bar = report.bars[i];
      return bar.death === null ? Infinity : Math.abs(bar.death - bar.birth);
    };
    const shown = [...indices].sort((x, y) => length(y) - length(x) || x - y).slice(0, SHOWN_PER_DIMENSION);
    shown.sort((x, y) => x - y);
    const rows = shown.map((i) => {
      const bar = report.bars[i];
      return [
        String(i),
        formatWeight(bar.birth),
        bar.death === null ? "never" : formatWeight(bar.death),
        draw(bar.birth, bar.death),
      ];
    });
    const hidden = indices.length - shown.length;
    const more =
      hidden > 0 ? `\n… and ${hidden} shorter bar${hidden === 1 ? "" : "s"} (--format csv lists all)` : "";
    sections.push(
      `H${dim}: ${indices.length} bar${indices.length === 1 ? "" : "s"}\n${textTable(["bar", "born", "dies", axisLabel(report, from, to, sign)], rows)}${more}`,
    );
    for (const i of shown) {
      const cycle = report.bars[i].cycle;
      if (cycle) sections.push(`bar ${i} loop: ${describeLoop(cycle, report.directed)}`);
    }
  }
  if (sections.length === 0) sections.push("no bars");
  return `${sections.join("\n\n")}\n`;
}

function axisLabel(report: BarcodeReport, from: number, to: number, sign: number): string {
  const left = formatWeight(sign * from);
  const right = formatWeight(sign * to);
  const relation = report.weights === "similarity" ? "w ≥" : "w ≤";
  const inner = Math.max(1, PICTURE_WIDTH - left.length - right.length - relation.length - 6);
  return `${relation} ${left} ${"─".repeat(inner)}▶ ${right}`;
}

/** Undirected loops read as a walk; directed ones list their arcs, since the walk may cross an arc backwards. */
function describeLoop(cycle: [string, string][], directed: boolean): string {
  if (directed) return cycle.map(([u, v]) => `${u}→${v}`).join(", ");
  return `${cycle.map(([u]) => u).join(" – ")} – ${cycle[0][0]}`;
}

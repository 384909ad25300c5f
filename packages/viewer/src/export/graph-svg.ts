import type { Core } from "cytoscape";
import type { GraphAnalysis } from "../compute/graph-analysis.js";
import { PALETTE } from "../palette.js";

const escapeXml = (text: string) =>
  text.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");

/**
 * The graph as drawn, as an SVG document: the edges shown at the current threshold (the first `shownEdges`
 * in entering order), the nodes, and the loop (given by its edge numbers; none when empty) emphasised as on
 * screen. Positions are cytoscape's model positions.
 */
export function graphSvg(
  cy: Core,
  analysis: Pick<GraphAnalysis, "sources" | "targets" | "directed">,
  shownEdges: number,
  title: string,
  loopEdgeNumbers: number[],
): string {
  const nodes = cy.nodes();
  const box = nodes.boundingBox({});
  const pad = 20;
  const x0 = box.x1 - pad;
  const y0 = box.y1 - pad;
  const width = Math.max(1, box.w + 2 * pad);
  const height = Math.max(1, box.h + 2 * pad);
  const { sources, targets, directed } = analysis;
  // While a loop is shown, everything else is drawn faded, as on screen.
  const loopEdges = new Set(loopEdgeNumbers);
  const faded = loopEdges.size > 0;
  let loopNodes = cy.collection();
  for (const e of loopEdges)
    loopNodes = loopNodes
      .union(cy.getElementById(`n${sources[e]}`))
      .union(cy.getElementById(`n${targets[e]}`));
  const at = nodes.map((node) => node.position());
  const lines: string[] = [];
  for (let e = 0; e < shownEdges; e++) {
    const s = at[sources[e]];
    const t = at[targets[e]];
    const loop = loopEdges.has(e);
    const colour = loop ? PALETTE.loop : faded ? PALETTE.edgeDimmed : PALETTE.edge;
    lines.push(
      `<line x1="${s.x.toFixed(1)}" y1="${s.y.toFixed(1)}" x2="${t.x.toFixed(1)}" y2="${t.y.toFixed(1)}" stroke="${colour}" stroke-width="${loop ? 4 : 1}"${directed ? ' marker-end="url(#arrow)"' : ""}${loop ? ' class="loop"' : ""}/>`,
    );
  }
  const circles: string[] = [];
  nodes.forEach((node) => {
    const p = node.position();
    const loop = loopNodes.contains(node);
    const r = Number.parseFloat(node.style("width")) / 2;
    const colour = loop ? PALETTE.loop : faded ? PALETTE.nodeDimmed : PALETTE.node;
    circles.push(
      `<circle cx="${p.x.toFixed(1)}" cy="${p.y.toFixed(1)}" r="${r.toFixed(1)}" fill="${colour}"/>`,
    );
    const label = loop ? (node.data("label") as string) : (node.style("label") as string);
    if (label) {
      circles.push(
        `<text x="${p.x.toFixed(1)}" y="${(p.y - r - 3).toFixed(1)}" font-size="${loop ? 11 : 9}" text-anchor="middle" fill="${loop ? PALETTE.ink : PALETTE.muted}">${escapeXml(label)}</text>`,
      );
    }
  });
  return `<?xml version="1.0" encoding="UTF-8"?>
<svg xmlns="http://www.w3.org/2000/svg" viewBox="${x0.toFixed(1)} ${y0.toFixed(1)} ${width.toFixed(1)} ${height.toFixed(1)}" width="${Math.round(width)}" height="${Math.round(height)}" font-family="system-ui, sans-serif">
<title>${escapeXml(title)}</title>
<defs><marker id="arrow" viewBox="0 0 10 10" refX="14" refY="5" markerWidth="6" markerHeight="6" orient="auto-start-reverse"><path d="M0,0 L10,5 L0,10 z" fill="${PALETTE.edge}"/></marker></defs>
<rect x="${x0.toFixed(1)}" y="${y0.toFixed(1)}" width="${width.toFixed(1)}" height="${height.toFixed(1)}" fill="${PALETTE.panel}"/>
<g>${lines.join("\n")}</g>
<g>${circles.join("\n")}</g>
</svg>
`;
}

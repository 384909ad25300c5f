import type { StylesheetJson } from "cytoscape";
import { PALETTE } from "../palette.js";

/** Node diameter in model units (unless sized by participation). */
export const NODE_SIZE = 9;

/**
 * How cytoscape draws the graph's nodes (nodes sized by participation read their size from `data(size)`),
 * and the edges it holds: the loop layer's, and the strongest edges while the force layout runs. The graph's
 * own edges are drawn by the edge layer (edge-layer.ts), in the same manner: arrowheads on straight edges
 * for directed graphs, centre-to-centre lines (haystack) for undirected ones.
 */
export function graphStyle(directed: boolean, showLabels: boolean): StylesheetJson {
  return [
    {
      selector: "node",
      style: {
        width: NODE_SIZE,
        height: NODE_SIZE,
        "background-color": PALETTE.node,
        "border-width": 0,
        label: showLabels ? "data(label)" : "",
        "font-size": 9,
        color: PALETTE.muted,
        "text-valign": "top",
        "text-margin-y": -2,
        "min-zoomed-font-size": 7,
      },
    },
    { selector: "node.sized", style: { width: "data(size)", height: "data(size)" } },
    {
      selector: "edge",
      style: {
        width: 1,
        "line-color": PALETTE.edge,
        "curve-style": directed ? "straight" : "haystack",
        "haystack-radius": 0,
        ...(directed
          ? { "target-arrow-shape": "triangle", "target-arrow-color": PALETTE.edge, "arrow-scale": 0.7 }
          : {}),
      },
    },
  ];
}

/**
 * The loop layer: only the loop's nodes and edges, over the graph's own rules (shapes, arrowheads). Loop
 * edges are thicker as well as coloured, so the loop stands out without relying on colour.
 */
export function loopLayerStyle(directed: boolean): StylesheetJson {
  return [
    ...graphStyle(directed, false),
    {
      selector: "edge",
      style: {
        width: 4,
        opacity: 1,
        "line-color": PALETTE.loop,
        "target-arrow-color": PALETTE.loop,
        "z-index": 10,
      },
    },
    {
      selector: "node",
      style: {
        width: 13,
        height: 13,
        "background-color": PALETTE.loop,
        "border-width": 2,
        "border-color": PALETTE.panel,
        label: "data(label)",
        color: PALETTE.ink,
        "font-size": 11,
        "font-weight": "bold",
        "text-background-color": PALETTE.panel,
        "text-background-opacity": 0.8,
        "z-index": 11,
      },
    },
  ];
}

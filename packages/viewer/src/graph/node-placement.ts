import type { Core, EdgeCollection, LayoutOptions } from "cytoscape";
import type { GraphAnalysis } from "../compute/graph-analysis.js";

/**
 * How many of the strongest edges the force layout uses: about four per node. Laying out every edge of a
 * dense matrix would pull all nodes into one ball; the strongest edges carry the structure.
 */
export function layoutEdgeCount(analysis: GraphAnalysis): number {
  return Math.min(analysis.sources.length, Math.max(4 * analysis.n, 1));
}

/** Preset positions from the data (y up, as in a plot), or the fcose force layout over the given edges. */
export function placeNodes(
  cy: Core,
  coordinates: Float64Array | null,
  layoutEdges: EdgeCollection,
): Promise<void> {
  if (coordinates) {
    const nodes = cy.nodes();
    const xs = nodes.map((_, v) => coordinates[2 * v]);
    const ys = nodes.map((_, v) => coordinates[2 * v + 1]);
    // About 100 model units per node along a side, whatever the data's units: neighbours land some 30 px apart.
    const span = Math.max(Math.max(...xs) - Math.min(...xs), Math.max(...ys) - Math.min(...ys)) || 1;
    const scale = (100 * Math.sqrt(nodes.length)) / span;
    cy.batch(() => {
      nodes.forEach((node, v) => {
        node.position({ x: xs[v] * scale, y: -ys[v] * scale });
      });
    });
    return Promise.resolve();
  }
  const n = cy.nodes().length;
  const layout = cy
    .nodes()
    .union(layoutEdges)
    .layout({
      name: "fcose",
      // Spectral placement alone for big graphs: seconds instead of minutes, still readable.
      quality: n > 1000 ? "draft" : "default",
      randomize: true,
      animate: false,
      nodeSeparation: 60,
      idealEdgeLength: 40,
      packComponents: true,
    } as unknown as LayoutOptions);
  const done = new Promise<void>((resolve) => layout.one("layoutstop", () => resolve()));
  layout.run();
  return done;
}

/**
 * The page's colours, our own. Series colours differ in lightness as well as hue, so they stay apart for
 * readers with a colour-vision deficiency; palette.test.ts checks every pair under simulated protanopia,
 * deuteranopia and tritanopia (Machado, Oliveira & Fernandes 2009, as implemented by culori).
 */
export const PALETTE = {
  paper: "#fbfaf6",
  panel: "#ffffff",
  ink: "#1c2230",
  muted: "#5d6472",
  rule: "#d9d6cc",
  /** Edges of the graph at rest, and the edges dimmed while a loop is shown. */
  edge: "#8d96a8",
  edgeDimmed: "#e4e2dc",
  node: "#33415c",
  nodeDimmed: "#c9c7c0",
  /** The loop being shown: its edges and nodes. */
  loop: "#d1495b",
  /** Focus ring and the current-threshold marker. */
  accent: "#0f7b8a",
} as const;

/**
 * Colours for series told apart by colour: homology dimensions (β0, β1, β2, …) and the labels of a run.
 * Dark blue, amber, plum, sky, brick, olive, then two more shades for long label lists.
 */
export const SERIES = [
  "#24528f",
  "#e69a28",
  "#7a3b82",
  "#62b3e0",
  "#b8452e",
  "#7c8a2b",
  "#1c2230",
  "#c9a3d9",
];

/** The Euler characteristic's line: ink, drawn dashed, so it never competes with a Betti curve's colour. */
export const EULER_COLOUR = PALETTE.ink;

export function seriesColour(index: number): string {
  return SERIES[index % SERIES.length];
}

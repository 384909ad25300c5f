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
  /** The loop being shown: its edges and nodes. A violet chosen to stay apart from everything around it. */
  loop: "#a45eff",
  /** Focus ring and the current-threshold marker. */
  accent: "#0f7b8a",
} as const;

/**
 * Colours for series told apart by colour: homology dimensions (β0, β1, β2, …) and the labels of a run.
 * Dark blue, amber, rust brown, light cyan, taupe, periwinkle, sage, aubergine: picked one at a time from
 * a grid of OKLCH colours, each the farthest (CIEDE2000) from those before it under normal vision and the
 * three simulated deficiencies at once. Charts also vary marker shape, so colour is never the only cue.
 */
export const SERIES = [
  "#2e5689",
  "#fbac16",
  "#772e00",
  "#6dcfdf",
  "#967b57",
  "#6483ff",
  "#b8c499",
  "#512d42",
];

/** The Euler characteristic's line: ink, drawn dashed, so it never competes with a Betti curve's colour. */
export const EULER_COLOUR = PALETTE.ink;

export function seriesColour(index: number): string {
  return SERIES[index % SERIES.length];
}

/**
 * The libraries' messages name their own settings (`nanIsNoEdge`, `maxDim`, …), which is right for a
 * TypeScript user. On the command line each remedy is restated with the option that does it; every
 * message and reader note the CLI prints goes through here. test/cli/cli-messages.test.ts makes the
 * libraries raise each of these messages, so a changed wording cannot slip through untranslated.
 */
const REMEDIES: readonly [RegExp, string][] = [
  [/\(set nanIsNoEdge to read NaN as "no edge"\)/, '(pass --nan-cells no-edge to read NaN as "no edge")'],
  [/raise maxCells if you have the memory/, "raise --max-nodes if you have the memory"],
  [/raise maxBytes if you have the memory/, "raise --max-file (MiB) if you have the memory"],
  [/set zeroIsEdge to keep them/, "pass --zero-edges to keep them"],
  [/with the labelsColumn option/, "with --labels-column"],
  [
    /read it as directed or choose a symmetri[sz]e policy \(max, min, mean\)/,
    "read it with --directed, or merge the two values with --symmetrize max|min|mean",
  ],
  [
    /choose a negative-weight policy \(abs, drop or keep\) to accept it/,
    "accept it with --negatives abs|drop|keep",
  ],
  [
    /Raise the budget, lower maxDim, or use a sparser threshold\./,
    "Raise --budget, lower --top-dim, or keep fewer edges (--threshold, --density).",
  ],
  [
    /lower maxDim, keep fewer edges, or raise budget\.maxBytes/,
    "lower --top-dim, keep fewer edges (--threshold, --density), or raise --memory",
  ],
  [/; lower maxDim$/, "; lower --top-dim"],
];

/** `message` with every library setting it recommends replaced by the command-line option that does it. */
export function cliMessage(message: string): string {
  let text = message;
  for (const [pattern, replacement] of REMEDIES) text = text.replace(pattern, replacement);
  return text;
}

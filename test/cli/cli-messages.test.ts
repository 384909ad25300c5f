/**
 * Every remedy the libraries recommend by one of their settings, raised by the libraries themselves and
 * restated by the command line with the option that does it. If a library's wording changes, the
 * translation no longer applies and these fail, instead of a user reading "set nanIsNoEdge".
 */
import { writeFileSync } from "node:fs";
import { join } from "node:path";
import { computeBarcode, countSimplices, fromDenseMatrix } from "@cliquescape/core";
import {
  encodeNpy,
  npyToGraphs,
  openDataset,
  parseDenseMatrixText,
  parseEdgeListText,
  parseNpy,
  readGraphFile,
} from "@cliquescape/io";
import { describe, expect, it } from "vitest";
import { cliMessage } from "../../packages/cli/src/cli-message.js";
import { binomialTable } from "../../packages/core/src/homology/binomial-table.js";
import { scratchFiles } from "./run-cli.js";

const LIBRARY_SETTINGS =
  /\b(maxDim|maxBytes|maxCells|nanIsNoEdge|zeroIsEdge|labelsColumn|addMissingNodes|budget\.)|policy/;

function messageOf(run: () => unknown): string {
  try {
    run();
  } catch (error) {
    return (error as Error).message;
  }
  throw new Error("expected an error");
}

const dir = scratchFiles({
  "m.csv": "0,1,2\n1,0,3\n2,3,0\n",
  "labels.csv": "id,group\nsub-1,a\n",
});
writeFileSync(join(dir, "stack.npy"), encodeNpy(new Array(8).fill(1), [2, 2, 2]));
const complete = fromDenseMatrix(12, new Array(144).fill(1), { directed: false });
const npy = (values: number[]) => parseNpy(encodeNpy(values, [2, 2]), "a.npy");

const cases: [string, () => string, RegExp][] = [
  [
    "a NaN weight, NaN refused",
    () => messageOf(() => npyToGraphs(npy([0, Number.NaN, Number.NaN, 0]), "a.npy", { nanIsNoEdge: false })),
    /pass --nan-cells no-edge/,
  ],
  [
    "a matrix above the cell limit",
    () => messageOf(() => readGraphFile(join(dir, "m.csv"), { maxCells: 4 })),
    /raise --max-nodes/,
  ],
  [
    "a file above the size limit",
    () => messageOf(() => readGraphFile(join(dir, "m.csv"), { maxBytes: 4 })),
    /raise --max-file/,
  ],
  [
    "zero-weight rows left out of an edge list (a note)",
    () => parseEdgeListText("source,target,weight\na,b,0\nb,c,1\n", "e.csv").warnings.join("; "),
    /pass --zero-edges to keep them/,
  ],
  [
    "an asymmetric matrix",
    () => messageOf(() => parseDenseMatrixText("0,1\n2,0\n", "m.csv")),
    /read it with --directed, or merge the two values with --symmetrize max\|min\|mean/,
  ],
  [
    "an asymmetric matrix, as the core says it",
    () => messageOf(() => fromDenseMatrix(2, [0, 1, 2, 0], { directed: false })),
    /--symmetrize max\|min\|mean/,
  ],
  [
    "a negative weight, negatives refused",
    () => messageOf(() => npyToGraphs(npy([0, -1, -1, 0]), "a.npy", { negative: "error" })),
    /accept it with --negatives abs\|drop\|keep/,
  ],
  [
    "a labels table without the label column",
    () => messageOf(() => openDataset(join(dir, "stack.npy"), { labelsFile: join(dir, "labels.csv") })),
    /with --labels-column/,
  ],
  [
    "the simplex budget",
    () => messageOf(() => countSimplices(complete, { budget: 10 })),
    /Raise --budget, lower --top-dim, or keep fewer edges \(--threshold, --density\)\.$/,
  ],
  [
    "the homology memory budget",
    () =>
      messageOf(() =>
        computeBarcode(complete, { semantics: "similarity", maxDim: 2, budget: { maxBytes: 64 } }),
      ),
    /lower --top-dim, keep fewer edges \(--threshold, --density\), or raise --memory$/,
  ],
  ["simplices too many to index", () => messageOf(() => binomialTable(100_000, 6)), /; lower --top-dim$/],
];

describe("library messages on the command line name options, not library settings", () => {
  it.each(cases)("%s", (_, produce, option) => {
    const message = produce();
    expect(message, "the library's own message names its setting").toMatch(LIBRARY_SETTINGS);
    const restated = cliMessage(message);
    expect(restated).toMatch(option);
    expect(restated).not.toMatch(LIBRARY_SETTINGS);
  });
});

import { existsSync, readFileSync } from "node:fs";
import { diagramOf, type EssentialRule, type PersistenceDiagram } from "@cliquescape/core";
import { textRows } from "@cliquescape/io";
import { graphPaths, runFolder } from "../extract/run-folder.js";
import { tableSetProblem } from "../extract/table-set.js";
import { UsageError } from "../options/graph-options.js";

/** How `distances` treats essential bars: cut at each barcode's end (or at a weight), dropped, or separate. */
export type EssentialChoice = "cut" | "drop" | "separate";

/**
 * The diagrams of one dimension of every finished graph of an extract run folder, in the order of its
 * features.csv (the dataset's order). Essential bars: "cut" ends them at `cutAt` when given, otherwise at
 * the barcode's own `end` (where its filtration stopped: the grid's last threshold under barcodeRange
 * "axis", the same for every graph on a weight grid).
 */
export function runDiagrams(
  root: string,
  dim: number,
  essential: EssentialChoice,
  cutAt: number | undefined,
): { ids: string[]; diagrams: PersistenceDiagram[] } {
  const folder = runFolder(root);
  if (!existsSync(folder.featuresCsv))
    throw new UsageError(`${root} is not a finished extract run folder: it has no features.csv`);
  const unfinished = tableSetProblem(folder);
  if (unfinished !== null)
    throw new UsageError(
      `${root}: the tables are not a whole set (${unfinished}); run the same extract command again to rewrite them`,
    );
  const ids: string[] = [];
  let first = true;
  for (const row of textRows(readFileSync(folder.featuresCsv, "utf8"), ",", folder.featuresCsv)) {
    if (first) {
      first = false;
      continue;
    }
    ids.push(row.cells[0]);
  }
  const diagrams = ids.map((id) => {
    const path = graphPaths(folder, id).barcode;
    if (!existsSync(path))
      throw new UsageError(
        `${path} is missing: the run was made with --no-barcodes, or the file was removed`,
      );
    const doc = JSON.parse(readFileSync(path, "utf8")) as BarcodeDocument;
    const rule: EssentialRule =
      essential === "cut" ? { kind: "cut", at: cutAt ?? doc.end } : { kind: essential };
    return diagramOf({ semantics: doc.weights, bars: doc.bars }, dim, rule);
  });
  return { ids, diagrams };
}

interface BarcodeDocument {
  weights: "distance" | "similarity";
  end: number;
  bars: { dim: number; birth: number; death: number | null }[];
}

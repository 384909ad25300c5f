import { InputFileError } from "./input-file-error.js";

/** Header names understood without being told, compared case-insensitively (common practice in edge-list files). */
export const SOURCE_NAMES = ["source", "src", "from", "node1", "node_1", "u", "i"];
export const TARGET_NAMES = ["target", "tgt", "dst", "dest", "to", "node2", "node_2", "v", "j"];
export const WEIGHT_NAMES = [
  "weight",
  "w",
  "value",
  "strength",
  "distance",
  "similarity",
  "correlation",
  "count",
];

/** Which cell of a row holds what; weight is absent for unweighted lists. 0-based. */
export interface EdgeColumns {
  source: number;
  target: number;
  weight?: number;
}

export interface EdgeColumnNames {
  /** Header name of the source column. Default: the first of SOURCE_NAMES found. */
  sourceColumn?: string;
  /** Header name of the target column. Default: the first of TARGET_NAMES found. */
  targetColumn?: string;
  /** Header name of the weight column, or null to read the list as unweighted. Default: WEIGHT_NAMES. */
  weightColumn?: string | null;
}

function find(header: readonly string[], wanted: readonly string[]): number {
  const lower = header.map((cell) => cell.toLowerCase());
  for (const name of wanted) {
    const at = lower.indexOf(name.toLowerCase());
    if (at >= 0) return at;
  }
  return -1;
}

/** True when a header row names a source and a target column: how an edge list is told from a matrix. */
export function looksLikeEdgeListHeader(header: readonly string[], names: EdgeColumnNames = {}): boolean {
  const source = find(header, names.sourceColumn ? [names.sourceColumn] : SOURCE_NAMES);
  const target = find(header, names.targetColumn ? [names.targetColumn] : TARGET_NAMES);
  return source >= 0 && target >= 0 && source !== target;
}

/** Locates the source, target and weight columns in a header row, or says clearly which one is missing. */
export function findEdgeColumns(
  header: readonly string[],
  names: EdgeColumnNames,
  file: string,
  line: number,
): { columns: EdgeColumns; warning?: string } {
  const listed = header.map((cell) => JSON.stringify(cell)).join(", ");
  const locate = (role: string, given: string | undefined, defaults: readonly string[], option: string) => {
    const at = find(header, given !== undefined ? [given] : defaults);
    if (at >= 0) return at;
    const wanted = given !== undefined ? `no column named ${JSON.stringify(given)}` : `no ${role} column`;
    throw new InputFileError(
      file,
      "bad-header",
      `${wanted} in the header (${listed}); name it with the ${option} option`,
      { line },
    );
  };
  const source = locate("source", names.sourceColumn, SOURCE_NAMES, "sourceColumn");
  const target = locate("target", names.targetColumn, TARGET_NAMES, "targetColumn");
  if (source === target) {
    throw new InputFileError(file, "bad-header", "source and target name the same column", {
      line,
      column: source + 1,
    });
  }
  if (names.weightColumn === null) return { columns: { source, target } };
  if (names.weightColumn !== undefined) {
    return { columns: { source, target, weight: locate("weight", names.weightColumn, [], "weightColumn") } };
  }
  const weight = find(header, WEIGHT_NAMES);
  if (weight >= 0) return { columns: { source, target, weight } };
  const others = header.filter((_, k) => k !== source && k !== target);
  const warning =
    others.length > 0
      ? `no weight column recognised among ${others.map((c) => JSON.stringify(c)).join(", ")}; every edge gets weight 1 (name one with weightColumn)`
      : undefined;
  return { columns: { source, target }, warning };
}

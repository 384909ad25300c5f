import { type Dirent, readdirSync, statSync } from "node:fs";
import { join } from "node:path";
import { InputFileError } from "../input-file-error.js";
import type { Dataset, DatasetEntry, DatasetProblem } from "./dataset-types.js";
import { fileStem, isGraphFileName } from "./graph-file-extensions.js";

/**
 * Every graph file directly in `folder` (not in sub-folders; hidden files skipped), sorted by name in
 * code-point order so every machine lists them alike. The id is the file name without its extension;
 * two files with the same id (a.csv, a.npy) keep the first and report the second.
 */
export function openFolderDataset(folder: string): Dataset {
  let names: string[];
  try {
    names = readdirSync(folder, { withFileTypes: true })
      .filter((d) => !d.name.startsWith(".") && isGraphFileName(d.name) && isFileOrLinkToFile(folder, d))
      .map((d) => d.name)
      .sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
  } catch (error) {
    throw new InputFileError(folder, "unreadable", `cannot list the folder: ${(error as Error).message}`);
  }
  const entries: DatasetEntry[] = [];
  const problems: DatasetProblem[] = [];
  const seen = new Map<string, string>();
  for (const name of names) {
    const id = fileStem(name);
    const first = seen.get(id);
    if (first !== undefined) {
      problems.push({
        id,
        file: join(folder, name),
        reason: `duplicate id "${id}": ${first} has the same name; skipped`,
      });
      continue;
    }
    seen.set(id, name);
    entries.push({
      id,
      file: join(folder, name),
      label: null,
      split: null,
      metadata: {},
      declaredAt: { file: folder },
    });
  }
  if (entries.length === 0 && problems.length === 0) {
    throw new InputFileError(
      folder,
      "empty-file",
      "the folder holds no graph files (.csv .tsv .txt .npy .npz .mat .graphml .gexf)",
    );
  }
  return { root: folder, kind: "folder", entries, problems };
}

// Datasets are often folders of symbolic links to the real files; follow them.
function isFileOrLinkToFile(folder: string, entry: Dirent): boolean {
  if (entry.isFile()) return true;
  if (!entry.isSymbolicLink()) return false;
  try {
    return statSync(join(folder, entry.name)).isFile();
  } catch {
    return false;
  }
}

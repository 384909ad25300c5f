import type { Dataset, OpenDatasetOptions } from "@cliquescape/io";
import type { ResolvedRunSpec } from "./run-spec.js";

/** spec.json: keys in a fixed order, the dataset's files with their hashes, no dates (reruns match byte for byte). */
export function specDocument(
  spec: ResolvedRunSpec,
  datasetArgument: string,
  dataset: Dataset,
  hashes: string[],
  manifestHash: string,
  relativeFile: (file: string) => string,
  datasetOptions: OpenDatasetOptions | undefined,
): string {
  const document = {
    format: spec.format,
    toolVersion: spec.toolVersion,
    ...(spec.connectivity ? { connectivity: spec.connectivity } : {}),
    preparation: spec.preparation,
    complex: spec.complex,
    grid: spec.grid,
    resolvedGrid: spec.resolvedGrid,
    nodeFeatures: spec.nodeFeatures,
    families: spec.families,
    vectorisation: spec.vectorisation,
    nullScores: spec.nullScores,
    outputs: spec.outputs,
    labelNames: spec.labelNames,
    nodeLayout: spec.nodeLayout,
    dataset: datasetArgument,
    ...(datasetOptions && Object.values(datasetOptions).some((v) => v !== undefined)
      ? { datasetOptions }
      : {}),
    inputs: [
      ...(dataset.kind === "manifest"
        ? [
            {
              id: "(manifest)",
              file: relativeFile(dataset.root),
              sha256: manifestHash,
            },
          ]
        : []),
      ...dataset.entries.map((entry, i) => ({
        id: entry.id,
        file: relativeFile(entry.file),
        sha256: hashes[i],
      })),
    ],
  };
  return `${JSON.stringify(document, null, 2)}\n`;
}

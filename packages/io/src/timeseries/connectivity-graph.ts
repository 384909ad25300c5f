import {
  type Connectivity,
  channelName,
  fromDenseMatrix,
  GraphInputError,
  type WeightedGraph,
} from "@cliquescape/core";
import { InputFileError } from "../input-file-error.js";
import { type GraphReadOptions, zeroIsEdge } from "../read-options.js";

/**
 * The network of a connectivity matrix, built under the same read options as a matrix file: isolated
 * channels and the diagonal carry no edges, a 0 is an edge only under `zeroIsEdge` (or distance
 * semantics), negative values follow `negative`. Directed unless `options.directed` says otherwise for a
 * directed measure (then `symmetrize` merges each pair of arcs). Errors name the two channels and the file.
 */
export function connectivityGraph(
  connectivity: Connectivity,
  file: string,
  measure: string,
  options: GraphReadOptions,
): { graph: WeightedGraph; warnings: string[] } {
  const { n, isolated } = connectivity;
  const values = Float64Array.from(connectivity.values);
  const zeroEdge = zeroIsEdge(options);
  for (let k = 0; k < values.length; k++) if (values[k] === 0 && !zeroEdge) values[k] = Number.NaN;
  for (const c of isolated) {
    for (let k = 0; k < n; k++) values[c * n + k] = values[k * n + c] = Number.NaN;
  }
  const warnings: string[] = [];
  try {
    const graph = fromDenseMatrix(n, values, {
      directed: options.directed ?? connectivity.directed,
      symmetrize: options.symmetrize,
      negative: options.negative,
      labels: connectivity.labels ?? options.labels,
      onWarning: (message) => warnings.push(message),
    });
    return { graph, warnings };
  } catch (error) {
    if (!(error instanceof GraphInputError)) throw error;
    const { row, col } = error.location;
    const pair =
      row === undefined || col === undefined
        ? ""
        : ` between ${channelName(connectivity, row)} and ${channelName(connectivity, col)}`;
    const problem =
      error.problem === "asymmetric" || error.problem === "negative-weight" ? error.problem : "not-finite";
    throw new InputFileError(file, problem, `${measure}${pair}: ${error.message}`, {}, { cause: error });
  }
}

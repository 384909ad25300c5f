import { asymmetryNote } from "@cliquescape/core";

/**
 * Why an undirected matrix is refused, with both values: `here` at the error's position, `there` at the
 * mirrored cell described by `mirrored` (e.g. "line 3, column 2"). A missing side reads "no edge".
 */
export function asymmetryReason(here: number, there: number, mirrored: string, tolerance?: number): string {
  const describe = (w: number) => (Number.isNaN(w) ? "no edge" : String(w));
  return (
    `matrix is not symmetric: ${describe(here)} here but ${describe(there)} at ${mirrored}` +
    `${asymmetryNote(here, there, tolerance)}; read it as directed or choose a symmetrize policy (max, min, mean)`
  );
}

/** The warning of a matrix reader that read NaN cells as "no edge" (numpy's corrcoef of a constant signal). */
export function nanCellsNote(cells: number): string {
  return `read ${cells} NaN cell${cells === 1 ? "" : "s"} as no edge`;
}

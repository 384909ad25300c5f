/** Ctrl-C before any graph was computed. */
export class InterruptedError extends Error {
  override name = "InterruptedError";
}

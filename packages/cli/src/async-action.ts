import { exitCodeFor } from "./exit-codes.js";

/**
 * Runs a command's asynchronous work (worker threads) the way main.ts handles synchronous commands: an
 * error is printed on one line and sets the exit code of its kind when the work settles.
 */
export function runAsyncAction(work: () => Promise<void>): void {
  void work().catch((error: unknown) => {
    const message = error instanceof Error ? error.message : String(error);
    process.stderr.write(`cliquescape: ${message}\n`);
    process.exitCode = exitCodeFor(error);
  });
}

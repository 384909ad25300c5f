import { CommanderError } from "commander";
import { exitCodeFor } from "./exit-codes.js";
import { createProgram } from "./program.js";

const program = createProgram().exitOverride();
try {
  program.parse(process.argv);
} catch (error) {
  if (error instanceof CommanderError) process.exit(error.exitCode);
  const message = error instanceof Error ? error.message : String(error);
  const hint =
    error instanceof Error && error.name === "TimeLimitError"
      ? "; raise --time-limit (seconds, 0: no limit), lower --top-dim or keep fewer edges"
      : "";
  process.stderr.write(`cliquescape: ${message}${hint}\n`);
  process.exit(exitCodeFor(error));
}

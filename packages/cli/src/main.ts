import { CommanderError } from "commander";
import { exitCodeFor } from "./exit-codes.js";
import { createProgram } from "./program.js";

const program = createProgram().exitOverride();
try {
  program.parse(process.argv);
} catch (error) {
  if (error instanceof CommanderError) process.exit(error.exitCode);
  const message = error instanceof Error ? error.message : String(error);
  process.stderr.write(`cliquescape: ${message}\n`);
  process.exit(exitCodeFor(error));
}

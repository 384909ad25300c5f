import { CommanderError } from "commander";
import { cliMessage } from "./cli-message.js";
import { exitCodeFor } from "./exit-codes.js";
import { createProgram } from "./program.js";

const program = createProgram().exitOverride();
// Subcommands added with addCommand do not inherit the override: without it they would exit(1) themselves.
for (const command of program.commands) command.exitOverride();
try {
  program.parse(process.argv);
} catch (error) {
  // Commander has printed its message; --help and --version end with 0, every other complaint of the
  // parser (unknown option, invalid choice, conflicting options, missing argument) is a bad command line.
  if (error instanceof CommanderError) process.exit(error.exitCode === 0 ? 0 : 2);
  const message = error instanceof Error ? error.message : String(error);
  const hint =
    error instanceof Error && error.name === "TimeLimitError"
      ? "; raise --time-limit (seconds, 0: no limit), lower --top-dim or keep fewer edges"
      : "";
  process.stderr.write(`cliquescape: ${cliMessage(message)}${hint}\n`);
  process.exit(exitCodeFor(error));
}

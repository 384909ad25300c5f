import { type Command, Option } from "commander";

export type OutputFormat = "table" | "csv" | "json";

export function addOutputOptions(command: Command): Command {
  return command.addOption(
    new Option("--format <format>", "how to print the result")
      .choices(["table", "csv", "json"])
      .default("table"),
  );
}

/**
 * The help of every command: it names every format the readers take, says what the command prints, and
 * leaves line breaking to the terminal (commander wraps descriptions to its width; a break typed inside a
 * sentence shows as a ragged line on any other width).
 */
import type { Command } from "commander";
import { describe, expect, it } from "vitest";
import { createProgram } from "../../packages/cli/src/program.js";
import { GRAPH_FILE_EXTENSIONS } from "../../packages/io/src/index.js";

const program = createProgram();
const commands = program.commands as Command[];

function wideHelp(command: Command): string {
  return command.configureHelp({ helpWidth: 100_000 }).helpInformation();
}

describe("cliquescape COMMAND --help", () => {
  it.each(commands.map((c) => [c.name(), c] as const))(
    "%s: no line break inside a description",
    (_, command) => {
      const texts = [
        command.description(),
        command.summary(),
        ...command.options.map((o) => o.description),
        ...command.registeredArguments.map((a) => a.description),
      ];
      for (const text of texts) expect(text, text).not.toContain("\n");
      // With a wide terminal every option's description is on its flags' line, whole.
      const help = wideHelp(command);
      for (const option of command.options)
        expect(help).toMatch(
          new RegExp(`${option.flags.replace(/[[\]|]/g, "\\$&")} +${literal(option.description)}`),
        );
    },
  );

  // Commands that read graph files (distances reads a run folder, connect recordings).
  const readers = commands.filter(
    (c) =>
      c.name() !== "connect" && c.registeredArguments.some((a) => ["file", "dataset"].includes(a.name())),
  );
  it.each(readers.map((c) => [c.name(), c] as const))("%s: lists every readable format", (_, command) => {
    const help = wideHelp(command);
    for (const extension of GRAPH_FILE_EXTENSIONS) expect(help, extension).toContain(extension);
  });

  it("connect: lists every format a recording can be in", () => {
    const help = wideHelp(commands.find((c) => c.name() === "connect")!);
    for (const extension of [".csv", ".tsv", ".txt", ".npy", ".npz", ".mat"])
      expect(help).toContain(extension);
  });

  it("inspect and sweep say they print Betti numbers", () => {
    for (const name of ["inspect", "sweep"]) {
      const command = commands.find((c) => c.name() === name)!;
      expect(command.summary()).toMatch(/Betti numbers/);
      expect(command.description()).toMatch(/Betti numbers/);
    }
  });
});

function literal(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
}

import { CONNECTIVITY_MEASURES } from "@cliquescape/core";
import { type Command, Option } from "commander";
import { nonNegativeInteger, UsageError } from "./graph-options.js";

/**
 * The options that turn recordings into connectivity matrices, shared by `connect` and `extract`. No
 * defaults here: unset options leave the spec's setting (extract) or the schema default (connect).
 */
export function addConnectivityOptions(command: Command): Command {
  return command
    .addOption(
      new Option("--measure <name>", "connectivity measure computed from each recording").choices([
        ...CONNECTIVITY_MEASURES,
      ]),
    )
    .addOption(new Option("--fisher-z", "Fisher's z = atanh(r) of every correlation"))
    .addOption(
      new Option("--max-lag <L>", "lagged: lags 1..L time points (required for lagged)").argParser(positive),
    )
    .addOption(
      new Option(
        "--window <w>",
        "coactivity: coincidences within ±w time bins (required for coactivity)",
      ).argParser(nonNegativeInteger),
    )
    .addOption(new Option("--channels-first", "recordings are channels × time (default: time × channels)"))
    .addOption(
      new Option(
        "--channels <n>",
        "every recording must have n channels (also tells an index column apart)",
      ).argParser(positive),
    )
    .addOption(
      new Option(
        "--bad-channels <how>",
        "channels with NaN or no variation: refuse the recording, or isolate them (no edges)",
      ).choices(["error", "isolate"]),
    );
}

/** The connectivity settings typed on the command line (undefined when none). */
export function connectivityFromOptions(raw: Record<string, unknown>): Record<string, unknown> | undefined {
  const section = {
    measure: raw.measure,
    fisherZ: raw.fisherZ,
    maxLag: raw.maxLag,
    window: raw.window,
    channelsFirst: raw.channelsFirst,
    channels: raw.channels,
    badChannels: raw.badChannels,
  };
  const set = Object.fromEntries(Object.entries(section).filter(([, v]) => v !== undefined));
  return Object.keys(set).length > 0 ? set : undefined;
}

function positive(text: string): number {
  const value = nonNegativeInteger(text);
  if (value < 1) throw new UsageError(`expected a whole number ≥ 1, got "${text}"`);
  return value;
}

const FLAGS: Record<string, string> = { maxLag: "--max-lag", window: "--window", fisherZ: "--fisher-z" };

/** A message about connectivity settings, with the spec's names (maxLag, …) as the options' (--max-lag, …). */
export function inOptionNames(message: string): string {
  return message.replace(/\b(maxLag|window|fisherZ)\b/g, (name) => FLAGS[name]);
}

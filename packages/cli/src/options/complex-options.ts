import { type Command, Option } from "commander";
import type { RunSpec } from "../extract/run-spec.js";
import { type Given, nonNegativeInteger, positiveInteger, UsageError } from "./graph-options.js";

/** Homology goes up to this dimension unless --top-dim says otherwise (H0, H1, H2). */
export const DEFAULT_HOMOLOGY_DIM = 2;

/**
 * Seconds one graph may take unless --time-limit says otherwise: long enough for any graph the tool is
 * meant for on one core, short enough that a runaway input stops the same day.
 */
export const DEFAULT_TIME_LIMIT_SECONDS = 600;

/** Limits on the complex: how high to go, in which coefficients, and how much work and memory to allow. */
export interface ComplexOptions {
  topDim?: number;
  budget?: number;
  prime: number;
  memoryBytes?: number;
  /** Null: no limit. */
  timeLimitSeconds: number | null;
  /** With --spec: the barcode covers the filtration up to the grid's end ("axis") or all of it ("full"). */
  barcodeRange: "axis" | "full";
}

export function addComplexOptions(command: Command): Command {
  return command
    .addOption(
      new Option(
        "--top-dim <k>",
        `highest simplex dimension; Betti numbers go to k-1 (default: counts uncapped, Betti to ${DEFAULT_HOMOLOGY_DIM})`,
      ).argParser(nonNegativeInteger),
    )
    .addOption(new Option("--prime <p>", "homology coefficients in Z/p").argParser(prime).default(2))
    .addOption(
      new Option("--budget <n>", "stop after counting this many simplices (default: the core's)").argParser(
        nonNegativeInteger,
      ),
    )
    .addOption(
      new Option("--memory <MiB>", "memory the homology computation may hold (default 2048)").argParser(
        positiveInteger,
      ),
    )
    .addOption(timeLimitOption());
}

/**
 * --time-limit, shared with extract: seconds per graph, 0 for none. Extract takes it without a default, so
 * the value of a --spec file stands unless the option is given.
 */
export function timeLimitOption(withDefault = true): Option {
  const option = new Option(
    "--time-limit <s>",
    `stop a graph that takes longer than this many seconds, saying how far it got (0: no limit; default ${DEFAULT_TIME_LIMIT_SECONDS})`,
  ).argParser(nonNegativeNumber);
  return withDefault
    ? option.default(DEFAULT_TIME_LIMIT_SECONDS, String(DEFAULT_TIME_LIMIT_SECONDS))
    : option;
}

/** Null for 0 (no limit). */
export function timeLimitOf(raw: Record<string, unknown>): number | null {
  const seconds = raw.timeLimit as number;
  return seconds === 0 ? null : seconds;
}

export function nonNegativeNumber(text: string): number {
  const value = Number(text);
  if (text.trim() === "" || !(value >= 0) || !Number.isFinite(value))
    throw new UsageError(`expected a number of seconds ≥ 0, got "${text}"`);
  return value;
}

/** The limits as typed, or, for each one not typed, those of `spec` (a run's spec.json) when one is given. */
export function complexOptionsOf(
  raw: Record<string, unknown>,
  spec: RunSpec | null = null,
  given: Given = () => true,
): ComplexOptions {
  const pick = <T>(option: string, typed: T, fromSpec: T): T => (spec && !given(option) ? fromSpec : typed);
  const memory = raw.memory as number | undefined;
  return {
    topDim: pick("topDim", raw.topDim as number | undefined, spec?.complex.topDim),
    budget: pick("budget", raw.budget as number | undefined, spec?.complex.simplexBudget ?? undefined),
    prime: pick("prime", raw.prime as number, spec?.complex.prime ?? 2),
    memoryBytes: pick(
      "memory",
      memory === undefined ? undefined : memory * 2 ** 20,
      (spec?.complex.homologyMemoryMiB ?? 0) * 2 ** 20,
    ),
    barcodeRange: spec?.complex.barcodeRange ?? "full",
    timeLimitSeconds: timeLimitOf(raw),
  };
}

/** Highest homology dimension computed: one below the top simplex dimension (-1: none). */
export function homologyDimOf(options: ComplexOptions): number {
  return options.topDim === undefined ? DEFAULT_HOMOLOGY_DIM : options.topDim - 1;
}

function prime(text: string): number {
  const p = nonNegativeInteger(text);
  for (let d = 2; d * d <= p; d++) if (p % d === 0) throw new UsageError(`--prime ${p} is not a prime`);
  if (p < 2) throw new UsageError(`--prime ${p} is not a prime`);
  return p;
}

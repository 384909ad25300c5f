import { NULL_MODELS, NULL_SCORE_FEATURES } from "@cliquescape/core";
import { z } from "zod";
import { ConnectivitySchema } from "../connect/connectivity-spec.js";
import { DEFAULT_TIME_LIMIT_SECONDS } from "../options/complex-options.js";

/**
 * The run spec: every setting of an extract run, the values it resolved (the grid, the label codes), the
 * tool version and the hash of every input. A user may write part of it by hand (`--spec FILE`: missing
 * settings take their defaults); a finished run writes it whole as spec.json, and passing that back with
 * --spec reproduces the same columns exactly.
 */

const positiveInt = z.number().int().min(1);

/**
 * Threshold values whose spread fits a float64: curve areas and spacings are differences of thresholds,
 * and a grid from -1e308 to 1e308 would give infinite areas and NaN (a tampered or mistyped spec).
 */
const thresholdValues = z
  .array(z.number())
  .min(1)
  .refine(
    (values) => {
      let low = Infinity;
      let high = -Infinity;
      for (const v of values) {
        if (v < low) low = v;
        if (v > high) high = v;
      }
      return Number.isFinite(high - low);
    },
    {
      message:
        "the values are so far apart that their difference overflows float64 (about 1.8e308): curve areas would be infinite; use thresholds in the range of the weights",
    },
  );

export const EDGE_TRANSFORMS = ["none", "one-minus", "neg-log", "reciprocal"] as const;

export const PreparationSchema = z
  .strictObject({
    /** auto: the manifest's `directed` column (undirected where it has none). */
    directed: z.enum(["auto", "directed", "undirected"]).default("auto"),
    /** What the weights mean after the transform: similarity (large = strong) or distance (small = close). */
    weights: z.enum(["similarity", "distance"]).default("similarity"),
    /**
     * How to merge a_ij and a_ji of a matrix read as undirected when they differ; "error" refuses it. Values
     * within a relative 1e-9 of each other are one weight (their mean) whatever this says.
     */
    symmetrize: z.enum(["error", "max", "min", "mean"]).default("error"),
    /** auto: a negative similarity is no edge (as 0 is), a negative distance is refused. */
    negatives: z.enum(["auto", "error", "abs", "drop", "keep"]).default("auto"),
    /** Whether a 0 read from a file is an edge; auto: no for similarity weights, yes for distances. */
    zeroEdges: z.enum(["auto", "edge", "no-edge"]).default("auto"),
    /** NaN cells (numpy's corrcoef of a constant signal): no edge, or refuse the graph. */
    nanCells: z.enum(["no-edge", "error"]).default("no-edge"),
    /** Largest matrix read, in nodes (n × n cells of 8 bytes are held while a matrix is read). */
    maxNodes: positiveInt.default(8192),
    /** Largest file read, in MiB; null: 256 for text, 2048 for .npy, .npz and .mat. */
    maxFileMiB: positiveInt.nullable().default(null),
    /** Applied to every edge value as read, before the weight semantics: 1−w, −log w, 1/w. */
    transform: z.enum(EDGE_TRANSFORMS).default("none"),
  })
  .prefault({});

export const ComplexSchema = z
  .strictObject({
    /** Simplices are counted up to this dimension; homology covers dimensions 0 .. topDim − 1. */
    topDim: positiveInt.max(12).default(3),
    prime: z.number().int().min(2).refine(isPrime, { message: "must be a prime number" }).default(2),
    /** Simplices one graph may enumerate before it is recorded as failed; null: the core's default. */
    simplexBudget: positiveInt.nullable().default(null),
    /** Memory the homology of one graph may hold, in MiB (per worker). */
    homologyMemoryMiB: positiveInt.default(1024),
    /**
     * Barcode of the filtration up to the grid's last threshold ("axis": far faster on dense graphs; bars
     * still alive there have no death) or of the whole filtration ("full").
     */
    barcodeRange: z.enum(["axis", "full"]).default("axis"),
    /**
     * Seconds one graph may take before it is stopped and recorded as failed, with how far it got; null: no
     * limit. Which graphs pass can depend on the machine, so a stopped graph is always in errors.csv; the
     * limit changes no feature value, so a run may be resumed under another one.
     */
    timeLimitSeconds: z.number().positive().nullable().default(DEFAULT_TIME_LIMIT_SECONDS),
  })
  .prefault({});

export const GridRequestSchema = z
  .discriminatedUnion("kind", [
    z.strictObject({ kind: z.literal("weights"), values: thresholdValues }),
    z.strictObject({
      kind: z.literal("quantiles"),
      /** Number of thresholds, evenly spaced in weight between the two dataset-wide quantiles. */
      steps: positiveInt.max(1000).default(20),
      from: z.number().min(0).max(1).default(0.05),
      to: z.number().min(0).max(1).default(0.95),
    }),
    z.strictObject({ kind: z.literal("densities"), values: z.array(z.number().min(0).max(1)).min(1) }),
  ])
  .prefault({ kind: "quantiles" });

/** The axis the grid resolved to: the exact values every feature column is read at. */
export const ResolvedGridSchema = z.strictObject({
  kind: z.enum(["weight", "density"]),
  values: thresholdValues,
  /** For a quantile grid: the weights at the two quantiles, over all edges of the dataset's first pass. */
  quantileWeights: z.tuple([z.number(), z.number()]).optional(),
  /** For a quantile grid: edges the first pass looked at (a sample when the dataset is very large). */
  edgesSampled: z.number().int().optional(),
});

export const NodeThresholdSchema = z
  .discriminatedUnion("kind", [
    z.strictObject({ kind: z.literal("all") }),
    z.strictObject({ kind: z.literal("weight"), value: z.number() }),
    z.strictObject({ kind: z.literal("density"), value: z.number().min(0).max(1) }),
  ])
  .prefault({ kind: "density", value: 0.1 });

export const FamiliesSchema = z
  .strictObject({
    simplexCounts: z.boolean().default(true),
    euler: z.boolean().default(true),
    betti: z.boolean().default(true),
    curveSummaries: z.boolean().default(true),
    barcodeSummaries: z.boolean().default(true),
    network: z.boolean().default(true),
    /** Vectorisations of the barcode (off by default): see docs/features.md. */
    landscapes: z.boolean().default(false),
    images: z.boolean().default(false),
    entropy: z.boolean().default(false),
    persistenceCurves: z.boolean().default(false),
  })
  .prefault({});

/** Settings of the vectorisation families (DEFAULT_VECTORISATION in core). */
export const VectorisationSchema = z
  .strictObject({
    essential: z.enum(["cut", "drop"]).default("cut"),
    landscapeLayers: z.number().int().min(1).max(100).default(3),
    imageResolution: z.number().int().min(1).max(200).default(10),
    imageSigma: z.number().positive().nullable().default(null),
    imageWeighting: z.enum(["linear", "none"]).default("linear"),
    curves: z
      .array(z.enum(["lifespan", "normalised-lifespan", "entropy"]))
      .default(["lifespan", "normalised-lifespan", "entropy"]),
  })
  .prefault({});

/** z-scored columns against a null model (off unless a model is named): see docs/null-models.md. */
export const NullScoresSchema = z
  .strictObject({
    /** null: no z-scored columns. */
    model: z.enum(NULL_MODELS).nullable().default(null),
    /** Null samples per graph; each graph draws samples 0 … samples − 1 of the seed. */
    samples: z.number().int().min(2).max(100000).default(100),
    seed: z.number().int().min(0).default(1),
    /** Which features get a z column: counts and Betti numbers at the threshold, Betti-curve areas. */
    features: z
      .array(z.enum(NULL_SCORE_FEATURES))
      .min(1)
      .default([...NULL_SCORE_FEATURES]),
    /** Where counts and Betti numbers are read (same choices as nodeFeatures.threshold). */
    threshold: NodeThresholdSchema,
    /** Rewiring: swap attempts per edge. */
    swapsPerEdge: z.number().min(0).max(1000).default(10),
  })
  .prefault({});

export const OutputsSchema = z
  .strictObject({
    /** One GNN bundle (.npz) per graph. */
    bundles: z.boolean().default(true),
    /** One barcode (.json) per graph. */
    barcodes: z.boolean().default(true),
  })
  .prefault({});

export const InputRecordSchema = z.strictObject({
  id: z.string(),
  file: z.string(),
  sha256: z.string(),
});

export const RunSpecSchema = z.strictObject({
  $schema: z.string().optional(),
  format: z.literal("cliquescape-run-spec/1").default("cliquescape-run-spec/1"),
  toolVersion: z.string().optional(),
  /**
   * Present when the dataset holds recordings (time series) instead of matrices: how each recording becomes a
   * connectivity matrix before the preparation below applies to it (see docs/connectivity.md).
   */
  connectivity: ConnectivitySchema.optional(),
  preparation: PreparationSchema,
  complex: ComplexSchema,
  grid: GridRequestSchema,
  resolvedGrid: ResolvedGridSchema.optional(),
  nodeFeatures: z.strictObject({ threshold: NodeThresholdSchema }).prefault({}),
  families: FamiliesSchema,
  vectorisation: VectorisationSchema,
  nullScores: NullScoresSchema,
  outputs: OutputsSchema,
  /** Label names in code order (y = index); resolved from the dataset when absent. */
  labelNames: z
    .array(z.string())
    .superRefine((names, context) => {
      const first = new Map<string, number>();
      names.forEach((name, k) => {
        const before = first.get(name);
        if (before === undefined) first.set(name, k);
        else
          context.addIssue({
            code: "custom",
            path: [k],
            message: `label ${JSON.stringify(name)} is listed twice (also at ${before}); each label has one code`,
          });
      });
    })
    .optional(),
  /**
   * Column layout of every bundle's node table; resolved from the dataset when absent: "directed" (in/out
   * degrees and strengths, participation as source and sink) when any graph is directed, so that every
   * bundle of a dataset has the same columns.
   */
  nodeLayout: z.enum(["directed", "undirected"]).optional(),
  /** Provenance only: the dataset and the files of this run. Never compared between runs. */
  dataset: z.string().optional(),
  datasetOptions: z
    .strictObject({
      labelsFile: z.string().optional(),
      labelsColumn: z.string().optional(),
      coordinatesFile: z.string().optional(),
      variable: z.string().optional(),
    })
    .optional(),
  inputs: z.array(InputRecordSchema).optional(),
});

/** A spec with every default filled in; resolved fields may still be missing. */
export type RunSpec = z.output<typeof RunSpecSchema>;
/** What a user may write: any part of a spec. */
export type RunSpecInput = z.input<typeof RunSpecSchema>;
export type GridRequest = RunSpec["grid"];
export type ResolvedGrid = z.output<typeof ResolvedGridSchema>;
export type NodeThreshold = RunSpec["nodeFeatures"]["threshold"];
export type EdgeTransform = (typeof EDGE_TRANSFORMS)[number];
export type Preparation = RunSpec["preparation"];

/** A spec after the first pass: the grid and the label codes are fixed. */
export type ResolvedRunSpec = RunSpec & {
  resolvedGrid: ResolvedGrid;
  labelNames: string[];
  nodeLayout: "directed" | "undirected";
  toolVersion: string;
};

/** The JSON Schema of the spec file, for editors and for docs/extract.md. */
export function runSpecJsonSchema(): unknown {
  return z.toJSONSchema(RunSpecSchema, { io: "input" });
}

function isPrime(p: number): boolean {
  if (p < 2) return false;
  for (let d = 2; d * d <= p; d++) if (p % d === 0) return false;
  return true;
}

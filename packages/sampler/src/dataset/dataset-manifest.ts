import { z } from "zod";
import { inputSchemaEntrySchema } from "../space/input-schema.js";

const sha = z.string().regex(/^[0-9a-f]{64}$/, "must be a hex SHA-256");
const count = z.number().int().nonnegative();

/** The zod schema of a dataset manifest (format version 1). */
export const datasetManifestSchema = z.strictObject({
  kind: z.literal("floorcast.dataset-manifest"),
  formatVersion: z.literal(1),
  /** The caution (FLOORCAST_CAUTION when written by floorcast). */
  caution: z.string(),
  scenario: z.strictObject({ name: z.string(), file: z.string(), sha256: sha }),
  design: z.string(),
  seed: z.union([z.number(), z.string()]),
  n: count,
  shard: z.strictObject({ index: count, count, start: count, end: count }),
  evaluator: z.string(),
  packageVersion: z.string(),
  columns: z.array(z.string()),
  /** Kind, bounds, scale and levels of each sampled input column (manifests written before it lack it). */
  inputSchema: z.array(inputSchemaEntrySchema).optional(),
  /** Present when the columns hold a plate profile (README "Plate profiles"). */
  plateProfile: z
    .strictObject({ storeys: count.min(1), ruleColumns: z.array(z.string()), naming: z.string() })
    .optional(),
  rows: count,
  csv: z.strictObject({ file: z.string(), bytes: count, sha256: sha }),
});

/**
 * The manifest written beside each dataset CSV: where the rows came from (scenario and its SHA-256, design,
 * seed, n, shard, evaluator, package version), the input schema of the sampled columns, and the SHA-256 (FIPS 180-4) of the CSV's bytes.
 */
export type DatasetManifest = z.infer<typeof datasetManifestSchema>;

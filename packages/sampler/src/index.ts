export type {
  LimitedBy,
  LotLine,
  MassingInput,
  MassingResult,
  Parcel,
  Point,
  Setbacks,
  SkyPlane,
  StoreyPlate,
} from "./massing/massing-types.js";
export { evaluateMassing } from "./massing/evaluate-massing.js";
export { massingProfile } from "./massing/massing-profile.js";
export { leastWidth } from "./geometry/least-width.js";
export type { MassingProfile } from "./massing/massing-profile.js";
export type { EvaluateMassingOptions } from "./massing/evaluate-massing.js";
export { quadParcel } from "./massing/quad-parcel.js";
export type { QuadParcelOptions } from "./massing/quad-parcel.js";
export type { ReadTableOptions, Table, TableRow, TableStream } from "./csv/table-types.js";
export { readTable } from "./csv/read-table.js";
export { openTableStream } from "./csv/open-table-stream.js";
export { createCsvWriter } from "./csv/create-csv-writer.js";
export type { CsvWriter, CsvWriterOptions } from "./csv/create-csv-writer.js";
export { formatCsvValue } from "./csv/format-csv-value.js";
export type { CsvValue } from "./csv/format-csv-value.js";
export type { Scenario } from "./scenario/scenario.js";
export { parseScenario } from "./scenario/parse-scenario.js";
export { loadScenario } from "./scenario/load-scenario.js";
export { scenarioToMassingInput } from "./scenario/scenario-to-massing-input.js";
export { SCENARIO_SLOTS } from "./scenario/scenario-slots.js";
export type { SlotDomain } from "./scenario/scenario-slots.js";
export type { BatchContext, Evaluator, EvaluatorFunction, EvaluatorInput, EvaluatorOutput, OutputGradient } from "./evaluator/evaluator.js";
export { EvaluatorProtocolError } from "./evaluator/evaluator-protocol-error.js";
export { functionEvaluator } from "./evaluator/function-evaluator.js";
export { massingEvaluator } from "./evaluator/massing-evaluator.js";
export type { MassingEvaluatorOptions } from "./evaluator/massing-evaluator.js";
export {
  PLATE_RULE_SLOTS,
  plateAreaColumn,
  plateProfileColumns,
  plateProfileLayout,
  plateWidthColumn,
} from "./evaluator/plate-profile-columns.js";
export { PLATE_PROFILE_NAMING, plateProfileOfColumns } from "./dataset/plate-profile-of-columns.js";
export { massingOutputs, MASSING_OUTPUT_COLUMNS } from "./evaluator/massing-outputs.js";
export { commandEvaluator } from "./evaluator/command-evaluator.js";
export type { CommandEvaluatorOptions } from "./evaluator/command-evaluator.js";
export { workerPoolEvaluator } from "./evaluator/worker-pool-evaluator.js";
export type { WorkerPoolEvaluatorOptions } from "./evaluator/worker-pool-evaluator.js";
export type { DatasetRow } from "./dataset/dataset-row.js";
export { generateDataset } from "./dataset/generate-dataset.js";
export type { GenerateDatasetOptions } from "./dataset/generate-dataset.js";
export { parseShard } from "./dataset/shard.js";
export type { Shard } from "./dataset/shard.js";
export { shardRange } from "./dataset/shard-range.js";
export { shardFromEnvironment } from "./dataset/shard-from-environment.js";
export type { EnvironmentShard } from "./dataset/shard-from-environment.js";
export { writeDataset } from "./dataset/write-dataset.js";
export type { WriteDatasetOptions } from "./dataset/write-dataset.js";
export { mergeShards } from "./dataset/merge-shards.js";
export { datasetManifestSchema } from "./dataset/dataset-manifest.js";
export { FLOORCAST_CAUTION } from "./floorcast-caution.js";
export { formatManifest } from "./dataset/format-manifest.js";
export { manifestPathFor } from "./dataset/manifest-path-for.js";
export { readManifest } from "./dataset/read-manifest.js";
export type { DatasetManifest } from "./dataset/dataset-manifest.js";
export { sha256File } from "./dataset/sha256-file.js";
export { recoverPartial } from "./dataset/recover-partial.js";
export type { RecoveredPartial } from "./dataset/recover-partial.js";
export { claimOutput } from "./output/claim-output.js";
export type { ClaimedOutput, ClaimOutputOptions, OutputDigest } from "./output/claim-output.js";
export { checkOutputPath } from "./output/check-output-path.js";
export type { CheckOutputOptions } from "./output/check-output-path.js";
export { acquireOutputLock, lockPathFor } from "./output/output-lock.js";
export { writeFileAtomically } from "./output/write-file-atomically.js";
export { createProgressBar } from "./dataset/progress-bar.js";
export type { ProgressBar } from "./dataset/progress-bar.js";
export type {
  CategoricalParameter,
  ContinuousParameter,
  IntegerParameter,
  Parameter,
} from "./space/parameter.js";
export type {
  CategoricalVariable,
  ContinuousVariable,
  IntegerVariable,
  Variable,
  VariableRecord,
} from "./space/variable.js";
export { createVariableCodec, modelRowBounds, rowValue } from "./space/variable-codec.js";
export type { VariableCodec } from "./space/variable-codec.js";
export { inputSchemaEntrySchema, inputSchemaOf, variablesOfSchema } from "./space/input-schema.js";
export type { InputSchemaEntry } from "./space/input-schema.js";
export { checkSchemaMatch } from "./space/check-schema-match.js";
export { checkSchemaRows } from "./space/check-schema-rows.js";
export { schemaLevels } from "./space/schema-levels.js";
export { latticeCount } from "./space/lattice-count.js";
export type { DesignSpace } from "./space/design-space.js";
export { validateDesignSpace } from "./space/validate-design-space.js";
export { mapUnitToSpace } from "./space/map-unit-to-space.js";
export { createDesign, DESIGN_KINDS } from "./design/create-design.js";
export type { CreateDesignOptions, DesignKind } from "./design/create-design.js";
export { defaultDesign, DEFAULT_OPTIMISED_MAX_N } from "./design/default-design.js";
export { DESIGN_COSTS } from "./design/design-costs.js";
export { designRows } from "./design/design-rows.js";
export type { DesignRowsOptions } from "./design/design-rows.js";
export { isStreamedDesign } from "./design/is-streamed-design.js";
export { extendDesign } from "./design/extend-design.js";
export type { ExtendDesignOptions } from "./design/extend-design.js";
export { sobolPoints } from "./design/sobol-points.js";
export { SOBOL_MAX_DIMS } from "./design/sobol-sequence.js";
export { minPairwiseDistance } from "./design/min-pairwise-distance.js";
export { phiP } from "./design/phi-p.js";
export { centredL2Discrepancy } from "./design/centred-l2-discrepancy.js";
export { isLatin } from "./design/is-latin.js";

export type {
  LimitedBy,
  LotLine,
  MassingInput,
  MassingResult,
  Parcel,
  Point,
  Setbacks,
  SkyPlane,
} from "./massing/massing-types.js";
export { evaluateMassing } from "./massing/evaluate-massing.js";
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
export type {
  CategoricalParameter,
  ContinuousParameter,
  IntegerParameter,
  Parameter,
} from "./space/parameter.js";
export type { DesignSpace } from "./space/design-space.js";
export { validateDesignSpace } from "./space/validate-design-space.js";
export { mapUnitToSpace } from "./space/map-unit-to-space.js";
export { createDesign, DESIGN_KINDS } from "./design/create-design.js";
export type { CreateDesignOptions, DesignKind } from "./design/create-design.js";
export { extendDesign } from "./design/extend-design.js";
export type { ExtendDesignOptions } from "./design/extend-design.js";
export { sobolPoints, SOBOL_MAX_DIMS } from "./design/sobol-points.js";
export { minPairwiseDistance } from "./design/min-pairwise-distance.js";
export { phiP } from "./design/phi-p.js";
export { centredL2Discrepancy } from "./design/centred-l2-discrepancy.js";
export { isLatin } from "./design/is-latin.js";

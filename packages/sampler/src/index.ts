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

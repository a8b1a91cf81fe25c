/**
 * The one caution every result floorcast shows a user carries, re-exported from `@floorcast/sampler` where it is
 * defined (so `@floorcast/bench`'s export of the same name keeps working).
 */
export { FLOORCAST_CAUTION } from "@floorcast/sampler";

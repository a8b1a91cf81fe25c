/**
 * The one caution every result floorcast shows a user carries (CLI output, optimum and benchmark files, reports):
 * surrogate and exact massing numbers inform early feasibility studies and decide nothing (common practice).
 */
export const FLOORCAST_CAUTION =
  "Estimates for early feasibility studies only: not a zoning determination. Local codes and licensed professionals decide.";

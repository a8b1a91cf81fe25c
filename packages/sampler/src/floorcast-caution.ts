/**
 * The one caution every result floorcast shows a user carries: dataset manifests, parcels' `fc_caution`, CLI output,
 * model files, trust, benchmark and ranking reports. It lives in the sampler because every other package can reach it
 * from here (the bench imports the sampler; the surrogate package, which may not, takes it as an input, with a default
 * a test pins equal to this). Surrogate and exact massing numbers inform early feasibility studies and decide nothing
 * (common practice).
 */
export const FLOORCAST_CAUTION =
  "Estimates for early feasibility studies only: not a zoning determination. Local codes and licensed professionals decide.";

/**
 * The caution a trust report carries when its caller gives none. The surrogate package may not import
 * `@floorcast/sampler`, where the one caution (FLOORCAST_CAUTION) is defined, so this is the same text, and a test
 * (tests/bench/caution-single-source.test.ts) pins it equal to that constant; floorcast's own callers (`assess`)
 * pass FLOORCAST_CAUTION explicitly. Estimates inform early feasibility studies and decide nothing (common practice).
 */
export const TRUST_REPORT_DEFAULT_CAUTION =
  "Estimates for early feasibility studies only: not a zoning determination. Local codes and licensed professionals decide.";

import { evaluateMassing, massingOutputs, type MassingInput } from "@floorcast/sampler";
import type { Design, Outputs } from "../optimize/optimization-problem.js";
import { countingEvaluator, type CountingEvaluator } from "../harness/counting-evaluator.js";
import { parcelDesignInput } from "./parcel-design-variables.js";

/**
 * The exact massing rule on one parcel as an optimizer's evaluator over PARCEL_DESIGN_VARIABLES: each design is
 * applied to the parcel's zoning controls (parcelDesignInput) and evaluated with evaluateMassing; the outputs are
 * the numeric massing outputs (`limitedBy` left out, `coverageCapped` as 0/1). A design the rule refuses gets NaN
 * outputs (infeasible), never an exception. Counts every design evaluated.
 * @param zone - the parcel's massing input at the zone's controls (metres).
 * @returns a counting evaluator.
 */
export function parcelEvaluator(zone: MassingInput): CountingEvaluator {
  const one = (d: Design): Outputs => {
    try {
      const out = massingOutputs(evaluateMassing(parcelDesignInput(zone, d)));
      return Object.fromEntries(Object.entries(out).filter((e): e is [string, number] => typeof e[1] === "number"));
    } catch (error) {
      if (error instanceof RangeError || error instanceof TypeError) return {};
      throw error;
    }
  };
  return countingEvaluator("exact: parcel", (batch) => Promise.resolve(batch.map(one)));
}

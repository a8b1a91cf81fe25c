/** Units of the massing rule's numeric outputs (README, "Result"): lengths in m, areas in m². */
export const OUTPUT_UNITS: Readonly<Record<string, string>> = {
  lotArea: "m²",
  buildableArea: "m²",
  footprintArea: "m²",
  floors: "floors",
  height: "m",
  gfa: "m²",
  far: "",
  coverage: "",
  openSpace: "m²",
  facadeLength: "m",
};

/**
 * The unit of an output ("" for ratios, counts of nothing and the test functions' unitless `f`).
 * @param output - output name.
 */
export function outputUnit(output: string): string {
  return OUTPUT_UNITS[output] ?? "";
}

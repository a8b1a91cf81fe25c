import type { Parameter } from "../space/parameter.js";

/**
 * A validated scenario: a design space over massing slots plus fixed values (see README "Scenario files"),
 * with the file it came from and that file's SHA-256.
 */
export interface Scenario {
  readonly kind: "floorcast.scenario";
  readonly formatVersion: 1;
  /** Short identifier: lower-case letters, digits and hyphens. */
  readonly name: string;
  readonly title: string;
  readonly description: string;
  /** Sampled parameters, in column order; each name is a massing slot. */
  readonly parameters: readonly Parameter[];
  /** Slot values that are not sampled. */
  readonly fixed: Readonly<Record<string, number | boolean | string>>;
  /** The file name the scenario was read from (for messages and manifests). */
  readonly fileName: string;
  /** Hex SHA-256 of the scenario file's bytes (or of the JSON text it was parsed from). */
  readonly sha256: string;
}

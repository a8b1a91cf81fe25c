import { expect } from "vitest";
import { FLOORCAST_CAUTION } from "@floorcast/sampler";

/** Caution-like wording: any text that says it is (not) a zoning determination or names who decides. */
export const CAUTION_WORDING = /zoning determination|licensed professionals/gi;

/**
 * Expects `text` (an output a user sees) to carry the caution as exactly FLOORCAST_CAUTION, at least once, and no
 * other caution-like wording: every match of CAUTION_WORDING lies inside a copy of the constant.
 * @param text - the output's text (HTML as written: the constant has no character HTML escapes).
 * @param what - names the output in failure messages.
 */
export function expectOnlyCaution(text: string, what: string): void {
  const copies = text.split(FLOORCAST_CAUTION).length - 1;
  expect(copies, `${what}: copies of FLOORCAST_CAUTION`).toBeGreaterThanOrEqual(1);
  const perCopy = FLOORCAST_CAUTION.match(CAUTION_WORDING)!.length;
  expect(text.match(CAUTION_WORDING)?.length ?? 0, `${what}: caution-like wording outside FLOORCAST_CAUTION`).toBe(copies * perCopy);
}

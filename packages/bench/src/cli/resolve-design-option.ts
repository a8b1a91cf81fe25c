import type { Writable } from "node:stream";
import { DEFAULT_OPTIMISED_MAX_N, DESIGN_COSTS, DESIGN_KINDS, defaultDesign, type DesignKind } from "@floorcast/sampler";
import { UsageError } from "./usage-error.js";

/** The help text of a `--design` option: every kind with its cost, and the default rule. */
export const DESIGN_OPTION_HELP =
  `design kind (${DESIGN_KINDS.map((k) => `${k}: ${DESIGN_COSTS[k]}`).join("; ")}); ` +
  `default lhs-maximin-cd up to n = ${DEFAULT_OPTIMISED_MAX_N}, sobol above`;

/**
 * The design a command uses: the one given with `--design` (checked), or defaultDesign(n, dims), which `announce`
 * states in one line on stderr once the run starts (so a user sees which design their rows come from, and a
 * mistake found before that still prints one line only).
 * @param command - the command's name, for messages. @param given - the `--design` text, if any.
 * @param n - design size. @param dims - dimensions. @param stderr - where the announcement goes.
 * @returns the design kind and `announce` (writes at most once; nothing when the design was given).
 * @throws UsageError for an unknown kind.
 */
export function resolveDesignOption(
  command: string,
  given: string | undefined,
  n: number,
  dims: number,
  stderr: Writable,
): { readonly design: DesignKind; readonly announce: () => void } {
  if (given !== undefined) {
    if (!(DESIGN_KINDS as readonly string[]).includes(given)) {
      throw new UsageError(`${command}: --design must be one of ${DESIGN_KINDS.join(", ")}, got ${JSON.stringify(given)}`);
    }
    return { design: given as DesignKind, announce: () => {} };
  }
  for (const [field, v] of [["n", n], ["dims", dims]] as const) {
    if (!(Number.isSafeInteger(v) && v >= 1)) throw new UsageError(`${command}: ${field} must be an integer ≥ 1, got ${v}`);
  }
  const design = defaultDesign(n, dims);
  let done = false;
  const announce = (): void => {
    if (done) return;
    done = true;
    stderr.write(
      `${command}: design ${design} (${DESIGN_COSTS[design]}), the default for n = ${n} ` +
        `(lhs-maximin-cd up to n = ${DEFAULT_OPTIMISED_MAX_N}, sobol above); choose another with --design\n`,
    );
  };
  return { design, announce };
}

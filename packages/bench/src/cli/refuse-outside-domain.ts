import { checkDomain, DomainError, type ValidityDomain } from "@floorcast/surrogate";
import { basename } from "node:path";
import { UsageError } from "./usage-error.js";

/**
 * Flags each row of a CSV inside/outside a model's domain of validity; with `strict`, refuses rows outside
 * with a UsageError naming their 1-based data row numbers (at most 20 listed).
 * @param command - command name, to start the message.
 * @param domain - the model's validity domain.
 * @param x - the CSV's input rows.
 * @param dataFile - the CSV's path, named in the message.
 * @param strict - refuse instead of flagging.
 * @returns `true` for each row inside.
 */
export function refuseOutsideDomain(command: string, domain: ValidityDomain, x: readonly (readonly number[])[], dataFile: string, strict: boolean): boolean[] {
  try {
    return checkDomain(domain, x, { strict }).rows.map((r) => r.inDomain);
  } catch (e) {
    if (!(e instanceof DomainError)) throw e;
    const rows = e.rows.slice(0, 20).map((i) => i + 1).join(", ");
    throw new UsageError(
      `${command}: --strict: data rows ${rows}${e.rows.length > 20 ? ", …" : ""} of ${basename(dataFile)} (${e.rows.length} in all) are outside the model's domain of validity`,
    );
  }
}

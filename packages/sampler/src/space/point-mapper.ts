import type { DesignSpace } from "./design-space.js";
import { levelMapper } from "./level-mapper.js";
import { validateDesignSpace } from "./validate-design-space.js";

/**
 * Maps one unit-cube row at a time to its parameter record without the rest of the design (for streamed designs,
 * isStreamedDesign): continuous parameters as mapUnitToSpace maps them, integer and categorical ones at level
 * ⌊x · levels⌋ of their coordinate.
 * @param space - the design space (validated).
 * @param fn - calling function named in messages.
 * @returns `(row) => record`, keyed by parameter name in parameter order.
 * @throws TypeError/RangeError for a bad space; the returned function throws RangeError for a row of the wrong
 * length or a coordinate outside [0, 1].
 */
export function createPointMapper(space: DesignSpace, fn = "createPointMapper"): (row: readonly number[]) => Record<string, number | string> {
  validateDesignSpace(space, fn);
  const d = space.parameters.length;
  const names = space.parameters.map((p) => p.name);
  const mappers = space.parameters.map((p) => levelMapper(p, undefined, 1));
  return (row) => {
    if (row.length !== d) throw new RangeError(`${fn}: a design row must have ${d} coordinates (one per parameter), got ${row.length}`);
    const record: Record<string, number | string> = {};
    for (let j = 0; j < d; j++) {
      const x = row[j] as number;
      if (!(x >= 0 && x <= 1)) throw new RangeError(`${fn}: coordinate ${j} (${names[j]}) must be in [0, 1], got ${x}`);
      record[names[j] as string] = (mappers[j] as (x: number, i: number) => number | string)(x, 0);
    }
    return record;
  };
}

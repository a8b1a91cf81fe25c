import type { DesignSpace } from "./design-space.js";

/**
 * Checks a design space and throws on the first problem.
 * Rules: at least one parameter; names are unique non-empty strings; unit and description are strings;
 * continuous: finite min < max, min > 0 when `log` is set, a step (if any) > 0; integer: integer min ≤ max;
 * categorical: at least one level, levels unique strings or finite numbers.
 * @param space - the space to check.
 * @param caller - the public function name that starts every message.
 * @throws TypeError when a field has the wrong type; RangeError (naming the parameter) for a bad value.
 */
export function validateDesignSpace(space: DesignSpace, caller = "validateDesignSpace"): void {
  if (typeof space !== "object" || space === null || !Array.isArray(space.parameters)) {
    throw new TypeError(`${caller}: space.parameters must be an array`);
  }
  if (space.parameters.length === 0) {
    throw new RangeError(`${caller}: space.parameters must not be empty`);
  }
  const seen = new Set<string>();
  space.parameters.forEach((p, i) => {
    if (typeof p !== "object" || p === null) {
      throw new TypeError(`${caller}: parameters[${i}] must be an object`);
    }
    if (typeof p.name !== "string" || p.name.length === 0) {
      throw new TypeError(`${caller}: parameters[${i}].name must be a non-empty string`);
    }
    const at = `parameter "${p.name}"`;
    if (seen.has(p.name)) throw new RangeError(`${caller}: ${at} is defined twice`);
    seen.add(p.name);
    if (typeof p.unit !== "string") throw new TypeError(`${caller}: ${at}: unit must be a string`);
    if (typeof p.description !== "string") {
      throw new TypeError(`${caller}: ${at}: description must be a string`);
    }
    switch (p.kind) {
      case "continuous": {
        checkBounds(caller, at, p.min, p.max);
        if (!(p.min < p.max)) {
          throw new RangeError(`${caller}: ${at}: min must be < max, got min ${p.min}, max ${p.max}`);
        }
        if (p.log !== undefined && typeof p.log !== "boolean") {
          throw new TypeError(`${caller}: ${at}: log must be a boolean`);
        }
        if (p.log === true && !(p.min > 0)) {
          throw new RangeError(`${caller}: ${at}: a log-scale parameter needs min > 0, got ${p.min}`);
        }
        if (p.step !== undefined && (typeof p.step !== "number" || !(Number.isFinite(p.step) && p.step > 0))) {
          throw new RangeError(`${caller}: ${at}: step must be a finite number > 0, got ${String(p.step)}`);
        }
        break;
      }
      case "integer": {
        checkBounds(caller, at, p.min, p.max);
        if (!Number.isInteger(p.min) || !Number.isInteger(p.max)) {
          throw new RangeError(`${caller}: ${at}: min and max must be integers, got ${p.min}, ${p.max}`);
        }
        if (!(p.min <= p.max)) {
          throw new RangeError(`${caller}: ${at}: min must be ≤ max, got min ${p.min}, max ${p.max}`);
        }
        break;
      }
      case "categorical": {
        if (!Array.isArray(p.levels)) throw new TypeError(`${caller}: ${at}: levels must be an array`);
        if (p.levels.length === 0) throw new RangeError(`${caller}: ${at}: levels must not be empty`);
        const levels = new Set<string | number>();
        for (const level of p.levels) {
          if (typeof level !== "string" && typeof level !== "number") {
            throw new TypeError(`${caller}: ${at}: levels must be strings or numbers`);
          }
          if (typeof level === "number" && !Number.isFinite(level)) {
            throw new RangeError(`${caller}: ${at}: level ${level} is not finite`);
          }
          if (levels.has(level)) throw new RangeError(`${caller}: ${at}: level ${String(level)} is repeated`);
          levels.add(level);
        }
        break;
      }
      default:
        throw new RangeError(
          `${caller}: ${at}: kind must be "continuous", "integer" or "categorical", got ${String((p as { kind: unknown }).kind)}`,
        );
    }
  });
}

function checkBounds(caller: string, at: string, min: unknown, max: unknown): void {
  if (typeof min !== "number" || typeof max !== "number") {
    throw new TypeError(`${caller}: ${at}: min and max must be numbers`);
  }
  if (!Number.isFinite(min) || !Number.isFinite(max)) {
    throw new RangeError(`${caller}: ${at}: min and max must be finite, got ${min}, ${max}`);
  }
}

import type { Evaluator } from "@floorcast/sampler";
import type { CommonOptions, OptimizationProblem } from "./optimization-problem.js";

function isRecord(v: unknown): v is Record<string, unknown> {
  return typeof v === "object" && v !== null && !Array.isArray(v);
}

function finiteNumber(fn: string, field: string, v: unknown): number {
  if (typeof v !== "number") throw new TypeError(`${fn}: ${field} must be a number, got ${typeof v}`);
  if (!Number.isFinite(v)) throw new RangeError(`${fn}: ${field} must be finite, got ${v}`);
  return v;
}

/**
 * Checks a problem, an evaluator and the common options at an optimizer's entry point.
 * Wrong types throw TypeError, bad values RangeError; messages start with `fn` and name the field.
 * @param fn - the public function's name, for messages.
 * @param problem - the problem to check.
 * @param evaluator - must have an `evaluate` function.
 * @param options - the common options (maxEvaluations ≥ 0 integer or Infinity).
 * @param objectives - "single" to require exactly one objective, "multi" to require at least two.
 */
export function validateProblem(
  fn: string,
  problem: OptimizationProblem,
  evaluator: Evaluator,
  options: CommonOptions,
  objectives: "single" | "multi" | "any" = "any",
): void {
  if (!isRecord(problem)) throw new TypeError(`${fn}: problem must be an object`);
  if (!Array.isArray(problem.variables)) throw new TypeError(`${fn}: problem.variables must be an array`);
  if (problem.variables.length === 0) throw new RangeError(`${fn}: problem.variables must not be empty`);
  const names = new Set<string>();
  problem.variables.forEach((v, i) => {
    const f = `problem.variables[${i}]`;
    if (!isRecord(v)) throw new TypeError(`${fn}: ${f} must be an object`);
    if (typeof v.name !== "string" || v.name === "") throw new TypeError(`${fn}: ${f}.name must be a non-empty string`);
    if (names.has(v.name)) throw new RangeError(`${fn}: ${f}.name "${v.name}" is a duplicate`);
    names.add(v.name);
    if (v.kind === "categorical") {
      if (!Array.isArray(v.levels)) throw new TypeError(`${fn}: ${f}.levels must be an array`);
      if (v.levels.length === 0) throw new RangeError(`${fn}: ${f}.levels must not be empty`);
      for (const l of v.levels) {
        if (typeof l !== "string" && typeof l !== "number") throw new TypeError(`${fn}: ${f}.levels must hold strings or numbers`);
      }
      if (new Set(v.levels).size !== v.levels.length) throw new RangeError(`${fn}: ${f}.levels must not repeat`);
    } else if (v.kind === "continuous" || v.kind === "integer") {
      const min = finiteNumber(fn, `${f}.min`, v.min);
      const max = finiteNumber(fn, `${f}.max`, v.max);
      if (min > max) throw new RangeError(`${fn}: ${f}.min must be ≤ max, got min ${min} > max ${max}`);
      if (v.kind === "integer" && (!Number.isInteger(min) || !Number.isInteger(max))) {
        throw new RangeError(`${fn}: ${f}.min and max must be integers, got ${min} and ${max}`);
      }
      if (v.kind === "continuous" && v.step !== undefined) {
        const s = finiteNumber(fn, `${f}.step`, v.step);
        if (s <= 0) throw new RangeError(`${fn}: ${f}.step must be > 0, got ${s}`);
      }
    } else {
      throw new RangeError(`${fn}: ${f}.kind must be "continuous", "integer" or "categorical"`);
    }
  });
  if (!Array.isArray(problem.objectives)) throw new TypeError(`${fn}: problem.objectives must be an array`);
  const k = problem.objectives.length;
  if (k === 0) throw new RangeError(`${fn}: problem.objectives must not be empty`);
  if (objectives === "single" && k !== 1) throw new RangeError(`${fn}: problem.objectives must hold exactly one objective, got ${k}`);
  if (objectives === "multi" && k < 2) throw new RangeError(`${fn}: problem.objectives must hold at least two objectives, got ${k}`);
  problem.objectives.forEach((o, i) => {
    if (!isRecord(o) || typeof o.output !== "string") throw new TypeError(`${fn}: problem.objectives[${i}].output must be a string`);
    if (o.sense !== "max" && o.sense !== "min") throw new RangeError(`${fn}: problem.objectives[${i}].sense must be "max" or "min"`);
  });
  const cons = problem.constraints ?? [];
  if (!Array.isArray(cons)) throw new TypeError(`${fn}: problem.constraints must be an array`);
  cons.forEach((c, i) => {
    if (!isRecord(c) || typeof c.output !== "string") throw new TypeError(`${fn}: problem.constraints[${i}].output must be a string`);
    if (c.op !== "<=" && c.op !== ">=") throw new RangeError(`${fn}: problem.constraints[${i}].op must be "<=" or ">="`);
    finiteNumber(fn, `problem.constraints[${i}].value`, c.value);
  });
  if (!isRecord(evaluator) || typeof evaluator.evaluate !== "function") {
    throw new TypeError(`${fn}: evaluator.evaluate must be a function`);
  }
  if (!isRecord(options)) throw new TypeError(`${fn}: options must be an object`);
  if (options.maxEvaluations !== undefined) {
    const m = options.maxEvaluations;
    if (typeof m !== "number") throw new TypeError(`${fn}: options.maxEvaluations must be a number`);
    if (!(m >= 0) || (Number.isFinite(m) && !Number.isInteger(m))) {
      throw new RangeError(`${fn}: options.maxEvaluations must be an integer ≥ 0, got ${m}`);
    }
  }
  if (options.seed !== undefined && typeof options.seed !== "number" && typeof options.seed !== "string") {
    throw new TypeError(`${fn}: options.seed must be a number or a string`);
  }
}

/**
 * Checks an optional numeric option against a lower bound (and integrality).
 * @returns the value, or `fallback` when undefined.
 */
export function numberOption(fn: string, name: string, v: unknown, fallback: number, min: number, integer = false): number {
  if (v === undefined) return fallback;
  if (typeof v !== "number") throw new TypeError(`${fn}: options.${name} must be a number`);
  if (!Number.isFinite(v) || v < min || (integer && !Number.isInteger(v))) {
    throw new RangeError(`${fn}: options.${name} must be ${integer ? "an integer " : ""}≥ ${min}, got ${v}`);
  }
  return v;
}

import type { Variable, VariableRecord } from "@floorcast/sampler";

/**
 * The optimization interface shared by every optimizer in `@floorcast/bench`.
 *
 * A problem is pure data ({@link OptimizationProblem}): variables, objectives and constraints on
 * outputs, its variables the sampler's one {@link Variable} contract. The function being optimized is the sampler's one
 * `Evaluator` contract (the exact massing evaluator, a user's command, a surrogate, or a published test function), so the
 * same problem runs on either; optimizers call only its `evaluate` (a batch of designs, in order) and optional `gradient`.
 * Every optimizer has the shape `optimizer(problem, evaluator, options) => Promise<OptimizationResult>`
 * and records how many designs it evaluated and how many times it called the evaluator.
 */

/** One design: variable name → value (a number, or a categorical level); the sampler's VariableRecord. */
export type Design = VariableRecord;

/** The outputs of one evaluated design: output name → value (NaN or a missing key means "could not evaluate"). */
export type Outputs = Readonly<Record<string, number>>;

/** An objective: maximise or minimise one named output. */
export interface Objective {
  readonly output: string;
  readonly sense: "max" | "min";
}

/**
 * A constraint on one output: `output op value`, e.g. `{ output: "height", op: "<=", value: 45 }`.
 * The g(x) ≤ 0 form is `{ output: "g", op: "<=", value: 0 }` with the evaluator returning g.
 */
export interface OutputConstraint {
  readonly output: string;
  readonly op: "<=" | ">=";
  readonly value: number;
}

/** An optimization problem: what to vary, what to optimize, what must hold. */
export interface OptimizationProblem {
  /** At least one variable; names unique. */
  readonly variables: readonly Variable[];
  /** At least one objective. Single-objective optimizers require exactly one. */
  readonly objectives: readonly Objective[];
  /** Constraints on outputs; a design violating any is infeasible. */
  readonly constraints?: readonly OutputConstraint[];
}

/** One evaluated design, as the optimizers record it. */
export interface EvaluatedDesign {
  readonly design: Design;
  readonly outputs: Outputs;
  /** Objective values in the problem's order, as the evaluator returned them (not sign-flipped). */
  readonly objectives: readonly number[];
  /** Total constraint violation Σ max(0, gᵢ)/max(1, |valueᵢ|); Infinity when invalid. */
  readonly violation: number;
  /** True when every constraint holds and every objective and constraint output is a finite number. */
  readonly feasible: boolean;
  /** False when an objective or constraint output is NaN, ±Infinity or missing. */
  readonly valid: boolean;
}

/** Options every optimizer accepts. */
export interface CommonOptions {
  /** Maximum number of designs evaluated (≥ 0; 0 evaluates nothing). */
  readonly maxEvaluations?: number;
  /** Seed for every random draw (seedrandom). Deterministic methods ignore it. */
  readonly seed?: number | string;
  /** Keep every evaluated design in `history` (default false). */
  readonly keepHistory?: boolean;
  /** Called after each evaluator call with designs evaluated so far and the planned total (or the budget). */
  readonly onProgress?: (done: number, total: number) => void;
}

/** What every optimizer returns. */
export interface OptimizationResult {
  /** Method name, e.g. "grid", "particle-swarm". */
  readonly method: string;
  /**
   * Best feasible design for the first objective (Deb's feasibility rules), or null when no
   * feasible design was evaluated. For multi-objective runs, the first objective's best.
   */
  readonly best: EvaluatedDesign | null;
  /** Feasible non-dominated designs (for one objective: the best, or empty). */
  readonly front: readonly EvaluatedDesign[];
  /** Designs evaluated (sum of batch sizes). */
  readonly evaluations: number;
  /** Calls to `evaluator.evaluate`. */
  readonly evaluatorCalls: number;
  /** Calls to `evaluator.gradient`. */
  readonly gradientCalls: number;
  /** Designs whose outputs were NaN/missing (treated as infeasible). */
  readonly invalid: number;
  /** Best feasible first-objective value after each evaluation (NaN until the first feasible one). */
  readonly trace: readonly number[];
  /** Why the run ended. */
  readonly stopped: "budget" | "complete" | "converged";
  /** Every evaluated design, in order, when `keepHistory` was set. */
  readonly history?: readonly EvaluatedDesign[];
}

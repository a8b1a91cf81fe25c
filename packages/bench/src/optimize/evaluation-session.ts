import { createVariableCodec, type Evaluator, type EvaluatorOutput, type OutputGradient, type VariableCodec } from "@floorcast/sampler";
import type { CommonOptions, EvaluatedDesign, OptimizationProblem, OptimizationResult, Outputs } from "./optimization-problem.js";
import { compareFeasibility, objectiveLoss } from "./feasibility-rules.js";
import { dominates } from "./pareto-dominance.js";

/**
 * Scores raw outputs against a problem: objective values, total violation
 * Σ max(0, gᵢ)/max(1, |valueᵢ|) (violations scaled so that constraints of different units
 * weigh alike; common practice), feasibility and validity (NaN/missing → invalid, infeasible).
 */
export function scoreOutputs(problem: OptimizationProblem, design: EvaluatedDesign["design"], answer: EvaluatorOutput): EvaluatedDesign {
  const outputs = numericOutputs(answer);
  const num = (name: string): number => {
    const v = outputs[name];
    return typeof v === "number" ? v : NaN;
  };
  const objectives = problem.objectives.map((o) => num(o.output));
  let valid = objectives.every((v) => Number.isFinite(v));
  let violation = 0;
  for (const c of problem.constraints ?? []) {
    const v = num(c.output);
    if (!Number.isFinite(v)) valid = false;
    const g = c.op === "<=" ? v - c.value : c.value - v;
    if (g > 0) violation += g / Math.max(1, Math.abs(c.value));
  }
  if (!valid) violation = Infinity;
  return { design, outputs, objectives, violation, feasible: valid && violation === 0, valid };
}

/** The numeric outputs of an answer (an evaluator may also answer strings or booleans, which optimizers do not read). */
function numericOutputs(answer: EvaluatorOutput): Outputs {
  for (const k in answer) {
    if (typeof answer[k] !== "number") {
      return Object.fromEntries(Object.entries(answer).filter((e): e is [string, number] => typeof e[1] === "number"));
    }
  }
  return answer as Outputs;
}

/**
 * Wraps an evaluator for one optimizer run: enforces the evaluation budget, counts designs,
 * evaluator calls and gradient calls, scores outputs, and keeps the best design (Deb's rules),
 * the feasible non-dominated archive, the best-so-far trace and (optionally) the history.
 */
export class EvaluationSession {
  readonly codec: VariableCodec;
  readonly budget: number;
  evaluations = 0;
  evaluatorCalls = 0;
  gradientCalls = 0;
  invalid = 0;
  best: EvaluatedDesign | null = null;
  private bestAny: EvaluatedDesign | null = null;
  private readonly front: EvaluatedDesign[] = [];
  private readonly frontLosses: number[][] = [];
  private readonly trace: number[] = [];
  private readonly history: EvaluatedDesign[] | undefined;

  constructor(
    readonly method: string,
    readonly problem: OptimizationProblem,
    private readonly evaluator: Evaluator,
    private readonly options: CommonOptions,
    private readonly planned = Infinity,
  ) {
    this.codec = createVariableCodec(problem.variables);
    this.budget = options.maxEvaluations ?? Infinity;
    this.history = options.keepHistory ? [] : undefined;
  }

  /** Designs still allowed by the budget. */
  get remaining(): number {
    return Math.max(0, this.budget - this.evaluations);
  }

  /** The best design by Deb's rules, feasible or not (null before any evaluation). */
  get leader(): EvaluatedDesign | null {
    return this.bestAny;
  }

  /**
   * Evaluates coded vectors (truncated to the remaining budget) in one evaluator call.
   * @returns the scored designs, in order (possibly fewer than asked).
   */
  async evaluate(xs: readonly (readonly number[])[]): Promise<EvaluatedDesign[]> {
    const take = xs.slice(0, Math.min(xs.length, this.remaining));
    if (take.length === 0) return [];
    const designs = take.map((x) => this.codec.toDesign(x));
    const outputs = await this.evaluator.evaluate(designs);
    this.evaluatorCalls++;
    if (!Array.isArray(outputs) || outputs.length !== designs.length) {
      throw new RangeError(
        `${this.method}: evaluator.evaluate returned ${Array.isArray(outputs) ? outputs.length : typeof outputs} outputs for ${designs.length} designs`,
      );
    }
    const scored = designs.map((d, i) => scoreOutputs(this.problem, d, outputs[i] ?? {}));
    for (const e of scored) this.record(e);
    this.options.onProgress?.(this.evaluations, Number.isFinite(this.planned) ? this.planned : this.budget);
    return scored;
  }

  /** Calls the evaluator's gradient (must exist) on coded vectors, counting the call. */
  async gradient(xs: readonly (readonly number[])[]): Promise<readonly OutputGradient[]> {
    const g = this.evaluator.gradient;
    if (g === undefined) throw new TypeError(`${this.method}: evaluator.gradient is missing`);
    this.gradientCalls++;
    return g.call(this.evaluator, xs.map((x) => this.codec.toDesign(x)));
  }

  /** True when the evaluator supplies gradients. */
  get hasGradient(): boolean {
    return typeof this.evaluator.gradient === "function";
  }

  private record(e: EvaluatedDesign): void {
    this.evaluations++;
    if (!e.valid) this.invalid++;
    this.history?.push(e);
    if (this.bestAny === null || compareFeasibility(this.problem, e, this.bestAny) < 0) this.bestAny = e;
    if (e.feasible) {
      if (this.best === null || objectiveLoss(this.problem, e) < objectiveLoss(this.problem, this.best)) this.best = e;
      if (this.problem.objectives.length > 1) this.addToFront(e);
    }
    this.trace.push(this.best === null ? NaN : this.best.objectives[0]!);
  }

  private addToFront(e: EvaluatedDesign): void {
    const le = this.problem.objectives.map((_, k) => objectiveLoss(this.problem, e, k));
    for (const lf of this.frontLosses) {
      if (dominates(lf, le) || lf.every((v, k) => v === le[k])) return;
    }
    for (let i = this.front.length - 1; i >= 0; i--) {
      if (dominates(le, this.frontLosses[i]!)) {
        this.front.splice(i, 1);
        this.frontLosses.splice(i, 1);
      }
    }
    this.front.push(e);
    this.frontLosses.push(le);
  }

  /** The run's result. */
  result(stopped: OptimizationResult["stopped"]): OptimizationResult {
    const front = this.problem.objectives.length > 1 ? [...this.front] : this.best ? [this.best] : [];
    const r: OptimizationResult = {
      method: this.method,
      best: this.best,
      front,
      evaluations: this.evaluations,
      evaluatorCalls: this.evaluatorCalls,
      gradientCalls: this.gradientCalls,
      invalid: this.invalid,
      trace: [...this.trace],
      stopped,
    };
    return this.history ? { ...r, history: [...this.history] } : r;
  }
}

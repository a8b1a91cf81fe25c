import { z } from "zod";

const finite = z.number().refine(Number.isFinite, { message: "must be a finite number" });
const name = z.string().min(1).regex(/^[A-Za-z][A-Za-z0-9_.-]*$/, {
  message: "must start with a letter and use letters, digits, _ . - only",
});

const variable = z
  .strictObject({
    /** A parameter of the scenario (or x1, x2 … of a test function). */
    name,
    /** Defaults to the scenario parameter's kind (continuous for a test function). */
    kind: z.enum(["continuous", "integer", "categorical"]).optional(),
    /** Bounds default to the scenario parameter's and must lie within them. */
    min: finite.optional(),
    max: finite.optional(),
    /** Lattice step of a continuous variable, e.g. 0.1 m floor-to-floor. */
    step: finite.refine((s) => s > 0, { message: "must be > 0" }).optional(),
    levels: z.array(z.union([z.string(), finite])).min(1).optional(),
  })
  .superRefine((v, ctx) => {
    if (v.min !== undefined && v.max !== undefined && !(v.max > v.min)) {
      ctx.addIssue({ code: "custom", message: `max must exceed min (${v.min})`, path: ["max"] });
    }
    if (v.kind === "integer" && v.step !== undefined) {
      ctx.addIssue({ code: "custom", message: "an integer variable takes every integer: no step", path: ["step"] });
    }
  });

const objective = z.strictObject({
  /** A numeric output of the evaluator (for massing: any numeric MassingResult field). */
  output: name,
  sense: z.enum(["maximise", "minimise"]),
});

const constraint = z
  .strictObject({ output: name, max: finite.optional(), min: finite.optional() })
  .refine((c) => (c.max === undefined) !== (c.min === undefined), {
    message: "give exactly one of max or min",
  });

const siteSelection = z.strictObject({
  /** How many parcels of the district to rank (≥ 200 in the demo). */
  count: z.number().int().min(2).max(100_000),
  /** Seed of the generated parcel list. */
  seed: z.union([z.number().int(), z.string().min(1)]),
  /** Scenario parameters that differ between sites (drawn within the scenario's ranges). */
  parameters: z.array(name).min(1),
  /** Length of the shortlist compared between exact and surrogate rankings. */
  shortlist: z.number().int().min(1).default(10),
});

/** Zod schema of a benchmark problem file (datasets/problems/*.json), format version 1. */
export const problemFileSchema = z
  .strictObject({
    kind: z.literal("floorcast.problem"),
    formatVersion: z.literal(1),
    name,
    title: z.string().min(1),
    description: z.string().min(1),
    /** Suites the problem belongs to, e.g. ["demo"]. */
    suites: z.array(name).min(1),
    /** Scenario file, relative to the problem file (massing problems). */
    scenario: z.string().min(1).optional(),
    /** Published test function (the standard suite) instead of a scenario. */
    testFunction: z.enum(["branin", "forrester", "six-hump-camel"]).optional(),
    /**
     * An external evaluator instead of a scenario: a command line (run by the shell in the problem file's folder)
     * speaking JSON Lines as `sample --evaluator-command` does; variables then give their kind and bounds or levels.
     */
    evaluatorCommand: z.string().min(1).optional(),
    /** Values of the scenario parameters that are not design variables (parcel, zoning). */
    fixed: z.record(z.string(), z.union([finite, z.string()])).default({}),
    variables: z.array(variable).min(1),
    objectives: z.array(objective).min(1).max(2),
    constraints: z.array(constraint).default([]),
    siteSelection: siteSelection.optional(),
    /** How the exact optimum is found: grid points per continuous variable, then local refinement. */
    exact: z
      .strictObject({
        gridPoints: z.number().int().min(2).max(10_000),
        refineEvaluations: z.number().int().min(0).default(200),
      })
      .default({ gridPoints: 21, refineEvaluations: 200 }),
  })
  .superRefine((p, ctx) => {
    if ([p.scenario, p.testFunction, p.evaluatorCommand].filter((x) => x !== undefined).length !== 1) {
      ctx.addIssue({ code: "custom", message: "give exactly one of scenario, testFunction or evaluatorCommand", path: ["scenario"] });
    }
    const seen = new Set<string>();
    p.variables.forEach((v, i) => {
      if (seen.has(v.name)) ctx.addIssue({ code: "custom", message: `duplicate variable "${v.name}"`, path: ["variables", i, "name"] });
      seen.add(v.name);
      if (v.name in p.fixed) {
        ctx.addIssue({ code: "custom", message: `"${v.name}" is both a variable and fixed`, path: ["variables", i, "name"] });
      }
    });
    if (p.siteSelection && p.objectives.length !== 1) {
      ctx.addIssue({ code: "custom", message: "site selection ranks by one objective", path: ["objectives"] });
    }
  });

/** A problem file as written (after defaults). */
export type ProblemFile = z.infer<typeof problemFileSchema>;

import type { Design, Outputs } from "../optimize/optimization-problem.js";
import { branin } from "./branin.js";
import { forrester } from "./forrester.js";
import { sixHumpCamel } from "./six-hump-camel.js";

/** Names of the published test functions of the standard suite. */
export type TestFunctionName = "branin" | "forrester" | "six-hump-camel";

/** Variable names each test function reads, in order. */
export const TEST_FUNCTION_VARIABLES: Readonly<Record<TestFunctionName, readonly string[]>> = {
  branin: ["x1", "x2"],
  forrester: ["x"],
  "six-hump-camel": ["x1", "x2"],
};

/**
 * The exact evaluator of a standard-suite problem: output `f` of the named published function
 * (Virtual Library of Simulation Experiments definitions, see each function's file).
 * @param fn - which function.
 * @returns design → { f }.
 */
export function testFunctionEvaluator(fn: TestFunctionName): (design: Design) => Outputs {
  const num = (d: Design, k: string): number => (typeof d[k] === "number" ? (d[k] as number) : Number.NaN);
  switch (fn) {
    case "branin":
      return (d) => ({ f: branin(num(d, "x1"), num(d, "x2")) });
    case "forrester":
      return (d) => ({ f: forrester(num(d, "x")) });
    case "six-hump-camel":
      return (d) => ({ f: sixHumpCamel(num(d, "x1"), num(d, "x2")) });
  }
}

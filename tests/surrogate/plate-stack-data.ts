import { generateDataset, massingEvaluator, parseScenario, type DatasetRow } from "@floorcast/sampler";
import { plateStackColumns, type PlateStackData } from "@floorcast/surrogate";

/** A scenario object of the invented district (test helper). */
export function scenarioOf(parameters: unknown[], fixed: Record<string, number | string>) {
  return parseScenario(
    { kind: "floorcast.scenario", formatVersion: 1, name: "plate-test", title: "t", description: "t", parameters, fixed },
    "plate-test.json",
  );
}

/** Samples a scenario with the plate profile and returns the plate-stack data and the raw rows (test helper). */
export async function plateData(
  scenario: ReturnType<typeof scenarioOf>,
  n: number,
  seed: number,
  design: "lhs-maximin" | "random" = "lhs-maximin",
): Promise<{ data: PlateStackData; rows: DatasetRow[] }> {
  const rows: DatasetRow[] = [];
  for await (const r of generateDataset(scenario, { n, design, seed, evaluator: massingEvaluator(scenario, { plateProfile: true }) })) rows.push(r);
  const inputs = scenario.parameters.map((p) => p.name);
  const { columns } = plateStackColumns(Object.keys(rows[0]!));
  const cols = Object.fromEntries([...columns, "gfa", "floors"].map((c) => [c, rows.map((r) => Number(r[c]))]));
  return { data: { inputs, x: rows.map((r) => inputs.map((c) => Number(r[c]))), columns: cols }, rows };
}

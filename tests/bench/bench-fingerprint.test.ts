import { afterAll, describe, expect, it } from "vitest";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { benchFingerprint } from "../../packages/bench/src/harness/bench-fingerprint.js";
import { loadProblem } from "../../packages/bench/src/problem/load-problem.js";

// A saved bench result is reused only when everything it depends on is unchanged.
const dir = mkdtempSync(join(tmpdir(), "floorcast-fingerprint-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const data = fileURLToPath(new URL("../../datasets/", import.meta.url));

describe("benchFingerprint", () => {
  it("changes with the scenario the problem names, the problem file and the options; not otherwise", async () => {
    const scenarioText = readFileSync(join(data, "scenarios/larkspur-terraces.json"), "utf8");
    writeFileSync(join(dir, "scenario.json"), scenarioText);
    const problemJson = JSON.parse(readFileSync(join(data, "problems/larkspur-fit-gfa.json"), "utf8"));
    problemJson.scenario = "scenario.json"; // relative to the problem file, as loadProblem resolves it
    const file = join(dir, "problem.json");
    writeFileSync(file, JSON.stringify(problemJson));
    const settings = { quick: true, seeds: [1] };
    const base = await benchFingerprint(await loadProblem(file), settings);
    expect(await benchFingerprint(await loadProblem(file), { ...settings })).toBe(base);
    // the scenario edited in place: another value of a fixed rule (the exact answers change)
    const scenario = JSON.parse(scenarioText);
    const key = Object.keys(scenario.fixed).find((k) => typeof scenario.fixed[k] === "number")!;
    scenario.fixed[key] = scenario.fixed[key] * 0.75;
    writeFileSync(join(dir, "scenario.json"), JSON.stringify(scenario, null, 2));
    const edited = await benchFingerprint(await loadProblem(file), settings);
    expect(edited).not.toBe(base);
    expect(await benchFingerprint(await loadProblem(file), { ...settings, seeds: [1, 2] })).not.toBe(edited);
    writeFileSync(file, JSON.stringify({ ...problemJson, title: `${problemJson.title}.` }));
    expect(await benchFingerprint(await loadProblem(file), settings)).not.toBe(edited);
  });
});

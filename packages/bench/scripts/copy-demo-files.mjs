// Copies the demo's scenario, problem and parcel files (datasets/scenarios, datasets/problems, datasets/parcels of the
// workspace) into packages/bench/dist/demo/, where `floorcast demo` and `floorcast bench` find them
// relative to the installed package. Run by the workspace's `npm run build`, after tsc.
import { cpSync, rmSync } from "node:fs";
import { fileURLToPath } from "node:url";

const workspace = fileURLToPath(new URL("../../../", import.meta.url));
const target = fileURLToPath(new URL("../dist/demo/", import.meta.url));
/** Folders of datasets/ the shipped problems need (problem files name their scenario as ../scenarios/...) and the demo's parcel file. */
const FOLDERS = ["problems", "scenarios", "parcels"];

rmSync(target, { recursive: true, force: true });
for (const folder of FOLDERS) {
  cpSync(`${workspace}datasets/${folder}`, `${target}${folder}`, { recursive: true, filter: (src) => !src.endsWith("~") && !src.endsWith(".mjs") });
}

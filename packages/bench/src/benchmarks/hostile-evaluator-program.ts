/**
 * The source of a hostile external evaluator (an .mjs file run as `node hostile.mjs MODE K`) for the
 * reliability tests and the hostile-runs benchmark. It answers area = frontage × depth, so a row that pairs one
 * design with another design's answer is visible. MODE: ok; extra (one more answer after line K); dup (the
 * same); skip (no answer to line K); swap (answers each pair of lines in reverse); garbage (line K answered
 * "oops"); noid (answers without ids); slow (every answer 5 ms late); crash (exits with status 3 at line K);
 * ordered-ok / ordered-extra (the in-order protocol without ids; the latter one extra answer at K).
 */
export const HOSTILE_PROGRAM = `import { createInterface } from "node:readline";
const [mode, kText] = process.argv.slice(2);
const k = Number(kText);
let n = 0;
let held = null;
const answer = (x) => JSON.stringify(mode.startsWith("ordered") || mode === "noid" ? { area: x.frontage * x.depth } : { sample: x.sample, area: x.frontage * x.depth }) + "\\n";
const sleep = (ms) => new Promise((r) => setTimeout(r, ms));
for await (const line of createInterface({ input: process.stdin })) {
  const x = JSON.parse(line);
  const i = n++;
  if (mode === "skip" && i === k) continue;
  if (mode === "crash" && i === k) { process.stderr.write("crashed\\n"); process.exit(3); }
  if (mode === "garbage" && i === k) { process.stdout.write("oops\\n"); continue; }
  if (mode === "slow") await sleep(5);
  if (mode === "swap") { if (held === null) { held = x; continue; } process.stdout.write(answer(x) + answer(held)); held = null; continue; }
  process.stdout.write(answer(x));
  if ((mode === "extra" || mode === "dup" || mode === "ordered-extra") && i === k) process.stdout.write(answer(x));
}
if (held !== null) process.stdout.write(answer(held));
`;

/** Modes after which a run must succeed with every row aligned; every other mode must fail (exit 1) with no dataset. */
export const HARMLESS_MODES: readonly string[] = ["ok", "slow", "ordered-ok"];

/** Every mode of {@link HOSTILE_PROGRAM}. */
export const HOSTILE_MODES: readonly string[] = ["ok", "slow", "ordered-ok", "extra", "dup", "skip", "swap", "garbage", "noid", "crash", "ordered-extra"];

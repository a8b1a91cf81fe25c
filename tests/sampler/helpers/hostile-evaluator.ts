/**
 * An external evaluator for tests (run as `node hostile.mjs MODE K`): answers area = frontage × depth, so any
 * row pairing one design with another's answer is visible. MODE: ok, extra (one more answer after line K),
 * dup (the same), skip (no answer to line K), swap (answers pairs in reverse), garbage (line K answered "oops"),
 * noid (no ids), ordered-ok / ordered-extra (in-order protocol without ids; the latter one extra answer at K).
 */
export const HOSTILE_PROGRAM = `import { createInterface } from "node:readline";
const [mode, kText] = process.argv.slice(2);
const k = Number(kText);
let n = 0;
let held = null;
const answer = (x) => JSON.stringify(mode.startsWith("ordered") || mode === "noid" ? { area: x.frontage * x.depth } : { sample: x.sample, area: x.frontage * x.depth }) + "\\n";
for await (const line of createInterface({ input: process.stdin })) {
  const x = JSON.parse(line);
  const i = n++;
  if (mode === "skip" && i === k) continue;
  if (mode === "garbage" && i === k) { process.stdout.write("oops\\n"); continue; }
  if (mode === "swap") { if (held === null) { held = x; continue; } process.stdout.write(answer(x) + answer(held)); held = null; continue; }
  process.stdout.write(answer(x));
  if ((mode === "extra" || mode === "dup" || mode === "ordered-extra") && i === k) process.stdout.write(answer(x));
}
if (held !== null) process.stdout.write(answer(held));
`;

// Child process of reliability-memory.test.ts: writes a CSV of ROWS rows with a long text column, then streams it
// back with openTableStream (collecting garbage every 5,000 rows) and reports the resident set size before and at its peak (sampled every 10 ms and
// after every 1,000 rows). Usage: node read-rss.mjs OUT.csv ROWS LABEL_LENGTH
import { createWriteStream, statSync } from "node:fs";
import { once } from "node:events";
import { openTableStream } from "@floorcast/sampler";

const [out, rowsText, labelText] = process.argv.slice(2);
const rows = Number(rowsText);
const label = "q".repeat(Number(labelText));
const w = createWriteStream(out);
w.write("a,b,c,kind\n");
for (let i = 0; i < rows; i++) {
  if (!w.write(`${i},${i * 0.5},${-i},${label}\n`)) await once(w, "drain");
}
w.end();
await once(w, "finish");
globalThis.gc?.();
const start = process.memoryUsage().rss;
let peak = start;
const timer = setInterval(() => (peak = Math.max(peak, process.memoryUsage().rss)), 10);
let count = 0;
let sum = 0;
for await (const r of await openTableStream(out, { columns: ["a", "b", "c"], categorical: ["kind"] })) {
  count++;
  sum += r.values[0];
  if (count % 1000 === 0) peak = Math.max(peak, process.memoryUsage().rss);
  // A collection now and then: the measure is what the reader keeps, not how late the collector runs on a busy machine.
  if (count % 5000 === 0) globalThis.gc();
}
clearInterval(timer);
peak = Math.max(peak, process.memoryUsage().rss);
console.log(JSON.stringify({ rows: count, sum, bytes: statSync(out).size, start, peak }));

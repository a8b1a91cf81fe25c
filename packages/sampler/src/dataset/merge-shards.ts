import { createReadStream, createWriteStream } from "node:fs";
import { open, stat } from "node:fs/promises";
import { basename } from "node:path";
import { pipeline } from "node:stream/promises";
import type { DatasetManifest } from "./dataset-manifest.js";
import { formatManifest } from "./format-manifest.js";
import { manifestPathFor } from "./manifest-path-for.js";
import { readManifest } from "./read-manifest.js";
import { sha256File } from "./sha256-file.js";
import { claimOutput, type ClaimedOutput } from "../output/claim-output.js";
import { shardRange } from "./shard-range.js";

async function headerLength(path: string): Promise<number> {
  const fh = await open(path, "r");
  try {
    const buf = Buffer.alloc(64 * 1024);
    const { bytesRead } = await fh.read(buf, 0, buf.length, 0);
    const nl = buf.subarray(0, bytesRead).indexOf(0x0a);
    if (nl < 0) throw new RangeError(`mergeShards: ${basename(path)} has no complete header line`);
    return nl + 1;
  } finally {
    await fh.close();
  }
}

const SAME = ["design", "seed", "n", "evaluator", "packageVersion"] as const;

/**
 * Joins the shards of one dataset (written with `shard: k/N`) into one CSV, byte-identical to the file an
 * unsharded run writes, with its manifest. Each shard's manifest is checked first: same scenario (name and
 * SHA-256), design, seed, n, evaluator, package version and columns; every shard 1…N present exactly once and
 * complete (its rows are the whole slice shardRange gives); each CSV's size and SHA-256 as its manifest records.
 * The outputs are claimed before any work (claimOutput: not a shard, an existing file only with `force`,
 * exclusive lock) and renamed into place only when complete.
 * @param shardPaths - the shard CSVs, in any order.
 * @param out - the merged CSV (its manifest goes beside it).
 * @param options - `force` replaces an existing `out`.
 * @returns the merged manifest (shard 1/1 covering all n rows).
 * @throws RangeError naming the shard and the mismatch.
 */
export async function mergeShards(
  shardPaths: readonly string[],
  out: string,
  options: { readonly force?: boolean } = {},
): Promise<DatasetManifest> {
  const fn = "mergeShards";
  if (!Array.isArray(shardPaths) || shardPaths.some((p) => typeof p !== "string")) {
    throw new TypeError(`${fn}: shardPaths must be an array of paths`);
  }
  if (typeof out !== "string" || out === "") throw new TypeError(`${fn}: out must be a non-empty path`);
  if (shardPaths.length === 0) throw new RangeError(`${fn}: no shards given`);
  const inputs = shardPaths.flatMap((p) => [p, manifestPathFor(p)]);
  const claim = await claimOutput([out, manifestPathFor(out)], { fn, force: options.force, inputs });
  try {
    return await mergeClaimed(shardPaths, out, claim);
  } finally {
    await claim.release();
  }
}

async function mergeClaimed(shardPaths: readonly string[], out: string, claim: ClaimedOutput): Promise<DatasetManifest> {
  const fn = "mergeShards";
  const manifests = await Promise.all(shardPaths.map((p) => readManifest(p, fn)));
  const first = manifests[0]!;
  const count = first.shard.count;
  const byIndex = new Map<number, string>();
  for (let i = 0; i < manifests.length; i++) {
    const m = manifests[i]!;
    const p = shardPaths[i]!;
    const name = basename(p);
    if (m.scenario.name !== first.scenario.name || m.scenario.sha256 !== first.scenario.sha256) {
      throw new RangeError(`${fn}: ${name} comes from another scenario (${m.scenario.name}, ${m.scenario.sha256.slice(0, 12)}…)`);
    }
    for (const key of SAME) {
      if (m[key] !== first[key]) {
        throw new RangeError(`${fn}: ${name} has ${key} ${JSON.stringify(m[key])}, ${basename(shardPaths[0]!)} has ${JSON.stringify(first[key])}`);
      }
    }
    if (JSON.stringify(m.columns) !== JSON.stringify(first.columns)) throw new RangeError(`${fn}: ${name} has other columns`);
    if (m.rows !== m.shard.end - m.shard.start) {
      throw new RangeError(`${fn}: ${name}: its manifest says ${m.rows} rows but shard ${m.shard.index}/${m.shard.count} covers ${m.shard.end - m.shard.start} (${name} is incomplete or altered)`);
    }
    if (m.shard.count !== count) throw new RangeError(`${fn}: ${name} is shard ${m.shard.index}/${m.shard.count}, not of ${count}`);
    const expected = shardRange(m.n, { index: m.shard.index, count });
    if (m.shard.start !== expected.start || m.shard.end !== expected.end || m.rows !== expected.end - expected.start) {
      throw new RangeError(
        `${fn}: ${name} is incomplete or not shard ${m.shard.index}/${count} of ${m.n} rows: it holds ${m.rows} rows of ${m.shard.start}…${m.shard.end - 1}, ` +
          `the shard is ${expected.start}…${expected.end - 1}`,
      );
    }
    const twice = byIndex.get(m.shard.index);
    if (twice !== undefined) throw new RangeError(`${fn}: shard ${m.shard.index}/${count} is given twice (${basename(twice)}, ${name})`);
    byIndex.set(m.shard.index, p);
    const size = (await stat(p)).size;
    if (size !== m.csv.bytes || (await sha256File(p)) !== m.csv.sha256) {
      throw new RangeError(`${fn}: ${name} does not match the SHA-256 in its manifest (changed or incomplete)`);
    }
  }
  const missing = Array.from({ length: count }, (_, k) => k + 1).filter((k) => !byIndex.has(k));
  if (missing.length > 0) throw new RangeError(`${fn}: shard${missing.length > 1 ? "s" : ""} ${missing.join(", ")} of ${count} missing`);
  const ordered = Array.from({ length: count }, (_, k) => byIndex.get(k + 1)!);
  const temp = claim.temporary(out);
  const sink = createWriteStream(temp);
  for (let k = 0; k < count; k++) {
    const path = ordered[k]!;
    const skip = k === 0 ? 0 : await headerLength(path);
    await pipeline(createReadStream(path, { start: skip }), sink, { end: k === count - 1 });
  }
  const manifest: DatasetManifest = {
    ...first,
    shard: { index: 1, count: 1, start: 0, end: first.n },
    rows: manifests.reduce((s, m) => s + m.rows, 0),
    csv: { file: basename(out), ...(await claim.seal(out)) },
  };
  await claim.put(manifestPathFor(out), formatManifest(manifest));
  await claim.commit();
  return manifest;
}

/**
 * Packs the workspace's three packages with `npm pack` and installs tarballs into a fresh project
 * offline (from npm's cache, which `npm ci` filled), as a user installing them would.
 * Used by the install test and the predictor-footprint benchmark; needs a built workspace.
 */
import { execFileSync } from "node:child_process";
import { copyFileSync, mkdirSync, writeFileSync } from "node:fs";
import { basename, join } from "node:path";
import { fileURLToPath } from "node:url";
import { tarballLockfile } from "./tarball-lockfile.js";

/** The workspace root (this file is packages/bench/{src,dist}/benchmarks/pack-workspace.*). */
export const WORKSPACE_ROOT = fileURLToPath(new URL("../../../../", import.meta.url));

/** The three packages, in dependency order. */
export const PACKAGE_NAMES = ["sampler", "surrogate", "bench"] as const;

/** npm's environment without the npm_* variables of an enclosing `npm test` (its workspace and script settings). */
function npmEnv(): NodeJS.ProcessEnv {
  const env: NodeJS.ProcessEnv = {};
  for (const [k, v] of Object.entries(process.env)) if (!k.toLowerCase().startsWith("npm_")) env[k] = v;
  return { ...env, npm_config_update_notifier: "false", npm_config_fund: "false", npm_config_audit: "false" };
}

/**
 * Runs npm with arguments in a folder.
 * @returns its stdout.
 */
export function runNpm(cwd: string, args: readonly string[]): string {
  return execFileSync("npm", [...args], { cwd, env: npmEnv(), encoding: "utf8", stdio: ["ignore", "pipe", "pipe"], maxBuffer: 64 << 20 });
}

/**
 * Packs @floorcast/sampler, @floorcast/surrogate and @floorcast/bench into `dest`.
 * @param dest - an existing folder.
 * @returns the tarball paths by package (sampler, surrogate, bench).
 */
export function packWorkspace(dest: string): Record<(typeof PACKAGE_NAMES)[number], string> {
  const args = ["pack", "--json", "--pack-destination", dest, ...PACKAGE_NAMES.flatMap((p) => ["-w", `packages/${p}`])];
  const packed = JSON.parse(runNpm(WORKSPACE_ROOT, args)) as { name: string; filename: string }[];
  const byName = new Map(packed.map((p) => [p.name, join(dest, p.filename)]));
  const out = {} as Record<(typeof PACKAGE_NAMES)[number], string>;
  for (const p of PACKAGE_NAMES) {
    const file = byName.get(`@floorcast/${p}`);
    if (file === undefined) throw new Error(`packWorkspace: npm pack did not produce @floorcast/${p}`);
    out[p] = file;
  }
  return out;
}

/**
 * Creates a fresh ES-module project in `dir` beside the tarballs and installs them into it with
 * `npm ci --offline` (a lockfile pinned to the workspace's, see {@link tarballLockfile}), so no
 * registry is asked anything.
 * @param dir - folder to create, in the folder that holds the tarballs.
 * @param tarballs - package name → tarball path.
 * @param optionalPeers - also install their optional peer dependencies.
 */
export function installTarballs(dir: string, tarballs: Readonly<Record<string, string>>, optionalPeers = false): void {
  mkdirSync(dir, { recursive: true });
  const name = "floorcast-install-check";
  const local: Record<string, string> = {};
  for (const [pkg, file] of Object.entries(tarballs)) {
    local[pkg] = join(dir, basename(file));
    copyFileSync(file, local[pkg]!);
  }
  const { lockfile, dependencies } = tarballLockfile(join(WORKSPACE_ROOT, "package-lock.json"), local, name, optionalPeers);
  writeFileSync(join(dir, "package.json"), `${JSON.stringify({ name, private: true, type: "module", dependencies }, null, 2)}\n`);
  writeFileSync(join(dir, "package-lock.json"), `${JSON.stringify(lockfile, null, 2)}\n`);
  runNpm(dir, ["ci", "--offline", "--ignore-scripts", "--no-audit", "--no-fund", "--loglevel=error"]);
}

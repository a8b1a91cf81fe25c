/**
 * A package-lock.json for a fresh project that depends on floorcast's tarballs: the tarballs
 * themselves (file: paths with their SHA-512 integrity) and, for every package they need, the
 * version and integrity the workspace's own lockfile pins. With it, `npm ci --offline` installs
 * from npm's cache alone (which `npm ci` in the workspace filled), with no registry metadata.
 */
import { createHash } from "node:crypto";
import { readFileSync } from "node:fs";
import { basename } from "node:path";

/** One entry of a version-3 lockfile's `packages` map (only what this file reads). */
interface LockEntry {
  readonly version?: string;
  readonly dependencies?: Readonly<Record<string, string>>;
  readonly optionalDependencies?: Readonly<Record<string, string>>;
  readonly peerDependencies?: Readonly<Record<string, string>>;
  readonly peerDependenciesMeta?: Readonly<Record<string, { readonly optional?: boolean }>>;
  readonly [key: string]: unknown;
}

/** The lockfile entry path Node would resolve `name` to from the package at `from` ("" = the project). */
function resolveEntry(packages: Readonly<Record<string, LockEntry>>, from: string, name: string): string | undefined {
  let dir = from;
  for (;;) {
    const candidate = `${dir === "" ? "" : `${dir}/`}node_modules/${name}`;
    if (packages[candidate] !== undefined) return candidate;
    if (dir === "") return undefined;
    const cut = dir.lastIndexOf("/node_modules/");
    dir = cut < 0 ? "" : dir.slice(0, cut);
  }
}

/** Names a package needs installed: dependencies, optional dependencies and peers (optional peers only when asked). */
function needs(entry: LockEntry, optionalPeers = false): string[] {
  const peers = Object.keys(entry.peerDependencies ?? {}).filter((p) => optionalPeers || entry.peerDependenciesMeta?.[p]?.optional !== true);
  return [...Object.keys(entry.dependencies ?? {}), ...Object.keys(entry.optionalDependencies ?? {}), ...peers];
}

/**
 * Builds the lockfile of a project whose package.json depends on `tarballs` as `file:` paths.
 * @param workspaceLock - path of the workspace's package-lock.json.
 * @param tarballs - package name → tarball path (the project refers to it as `file:<basename>` beside it).
 * @param projectName - the project's name.
 * @param optionalPeers - also install the tarballs' optional peer dependencies (as a user who adds them).
 * @returns the lockfile and the package.json dependencies.
 */
export function tarballLockfile(
  workspaceLock: string,
  tarballs: Readonly<Record<string, string>>,
  projectName: string,
  optionalPeers = false,
): { lockfile: unknown; dependencies: Record<string, string> } {
  const ws = JSON.parse(readFileSync(workspaceLock, "utf8")) as { packages: Record<string, LockEntry> };
  const dependencies: Record<string, string> = {};
  const out: Record<string, unknown> = {};
  const todo: [string, string][] = [];
  for (const [name, file] of Object.entries(tarballs)) {
    const spec = `file:${basename(file)}`;
    dependencies[name] = spec;
    const workspaceDir = ws.packages[`node_modules/${name}`]?.["resolved"];
    const manifest = typeof workspaceDir === "string" ? ws.packages[workspaceDir] : undefined;
    if (manifest === undefined) throw new RangeError(`tarballLockfile: ${name} is not a workspace package`);
    const integrity = `sha512-${createHash("sha512").update(readFileSync(file)).digest("base64")}`;
    const { name: _n, ...rest } = manifest;
    void _n;
    out[`node_modules/${name}`] = { ...rest, resolved: spec, integrity };
    for (const dep of needs(manifest, optionalPeers)) todo.push([`node_modules/${name}`, dep]);
    // A user who wants an optional peer installs it themselves: it becomes the project's own dependency.
    if (optionalPeers) {
      for (const [peer, range] of Object.entries(manifest.peerDependencies ?? {})) {
        if (manifest.peerDependenciesMeta?.[peer]?.optional === true) dependencies[peer] = range;
      }
    }
  }
  while (todo.length > 0) {
    const [from, name] = todo.pop()!;
    if (tarballs[name] !== undefined) continue;
    const at = resolveEntry(ws.packages, from, name);
    if (at === undefined) throw new RangeError(`tarballLockfile: ${name} (needed by ${from}) is not in the workspace lockfile`);
    if (out[at] !== undefined) continue;
    const { dev: _d, devOptional: _o, peer: _p, ...entry } = ws.packages[at]!;
    void _d, void _o, void _p;
    out[at] = entry;
    for (const dep of needs(entry)) todo.push([at, dep]);
  }
  const sorted = Object.fromEntries(Object.entries(out).sort(([a], [b]) => a.localeCompare(b)));
  const lockfile = {
    name: projectName,
    lockfileVersion: 3,
    requires: true,
    packages: { "": { name: projectName, dependencies }, ...sorted },
  };
  return { lockfile, dependencies };
}

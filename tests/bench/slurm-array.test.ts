import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import { randomBytes } from "node:crypto";
import { chmodSync, existsSync, mkdirSync, mkdtempSync, openSync, readFileSync, readdirSync, rmSync, writeFileSync } from "node:fs";
import { createServer } from "node:net";
import { hostname, tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";

// Integration test against a real scheduler: a single-node Slurm (Debian's slurm-wlm 22.05 and munge 0.5) on
// localhost runs datasets/cluster/sample-array.sbatch as a 3-task job array (`sbatch --array`); the shards, joined by
// `floorcast merge`, must be byte-identical to an unsharded `floorcast sample`. The array variables read are those
// of the Slurm documentation, "Job Array Support" (SLURM_ARRAY_TASK_ID, _MIN, _STEP, _COUNT).

const root = fileURLToPath(new URL("../../", import.meta.url));
const floorcast = join(root, "packages/bench/bin/floorcast.js");
const script = join(root, "datasets/cluster/sample-array.sbatch");
const scenario = join(root, "datasets/scenarios/larkspur-terraces.json");
const TOOLS = ["/usr/sbin/munged", "/usr/sbin/slurmctld", "/usr/sbin/slurmd", "/usr/bin/sbatch", "/usr/bin/squeue", "/usr/bin/sinfo", "/usr/bin/scancel"];

/** Whether the scheduler can be started here; a skip is loud, and under FLOORCAST_REQUIRE_REFERENCE=1 (CI) a failure. */
function slurmAvailable(): boolean {
  const missing = TOOLS.filter((t) => !existsSync(t));
  const root = process.getuid?.() === 0;
  if (missing.length === 0 && root) return true;
  const why = missing.length > 0 ? `missing ${missing.join(", ")} (apt-get install -y slurm-wlm munge)` : "slurmd must run as root here";
  const msg = `\n!!! SLURM INTEGRATION TEST SKIPPED: ${why}.\n`;
  if (process.env.FLOORCAST_REQUIRE_REFERENCE === "1") throw new Error(msg);
  console.warn(msg);
  return false;
}

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once("error", reject);
    s.listen(0, "127.0.0.1", () => {
      const port = (s.address() as { port: number }).port;
      s.close(() => resolve(port));
    });
  });
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Polls `check` every half second until it is true; fails with `what` after `ms`. */
async function waitFor(what: string, check: () => boolean, ms: number, logs: () => string): Promise<void> {
  const end = Date.now() + ms;
  while (!check()) {
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}\n${logs()}`);
    await sleep(500);
  }
}

const run = slurmAvailable();
const dir = run ? mkdtempSync(join(tmpdir(), "fc-slurm-")) : "";
const daemons: ChildProcess[] = [];
let env: NodeJS.ProcessEnv = {};
let jobId: string | undefined;

/** The daemons' logs, shown when something times out. */
function logs(): string {
  return ["munged.out", "slurmctld.log", "slurmd.log", "slurmctld.out", "slurmd.out", ...(existsSync(dir) ? readdirSync(dir).filter((f) => f.endsWith(".log")) : [])]
    .filter((f, i, all) => all.indexOf(f) === i && existsSync(join(dir, f)))
    .map((f) => `--- ${f}\n${readFileSync(join(dir, f), "utf8").split("\n").slice(-15).join("\n")}`)
    .join("\n");
}

/** Starts a daemon in the foreground (so its pid is the child's) with its output in dir/<name>.out. */
function startDaemon(name: string, command: string, args: string[]): void {
  const out = openSync(join(dir, `${name}.out`), "w");
  const child = spawn(command, args, { env, stdio: ["ignore", out, out] });
  daemons.push(child);
}

/** Stops every daemon this test started, by its pid: SIGTERM, then SIGKILL after 10 s. */
async function stopDaemons(): Promise<void> {
  for (const child of daemons.reverse()) {
    if (child.exitCode !== null || child.signalCode !== null || child.pid === undefined) continue;
    const exited = new Promise<void>((r) => child.once("exit", () => r()));
    process.kill(child.pid, "SIGTERM");
    const t = setTimeout(() => child.pid !== undefined && child.exitCode === null && process.kill(child.pid, "SIGKILL"), 10_000);
    await exited;
    clearTimeout(t);
  }
}

describe.skipIf(!run)("a Slurm job array of floorcast sample shards (single-node Slurm on localhost)", () => {
  beforeAll(async () => {
    const node = hostname().split(".")[0]!;
    mkdirSync(join(dir, "state"));
    mkdirSync(join(dir, "spool"));
    mkdirSync(join(dir, "out"));
    const key = join(dir, "munge.key");
    writeFileSync(key, randomBytes(1024));
    chmodSync(key, 0o400);
    const socket = join(dir, "munge.sock");
    const [ctldPort, dPort] = [await freePort(), await freePort()];
    const conf = join(dir, "slurm.conf");
    writeFileSync(
      conf,
      [
        "ClusterName=floorcasttest",
        `SlurmctldHost=${node}(127.0.0.1)`,
        `SlurmctldPort=${ctldPort}`,
        `SlurmdPort=${dPort}`,
        "AuthType=auth/munge",
        `AuthInfo=socket=${socket}`,
        "CredType=cred/munge",
        "SlurmUser=root",
        "SlurmdUser=root",
        `StateSaveLocation=${join(dir, "state")}`,
        `SlurmdSpoolDir=${join(dir, "spool")}`,
        `SlurmctldPidFile=${join(dir, "slurmctld.pid")}`,
        `SlurmdPidFile=${join(dir, "slurmd.pid")}`,
        `SlurmctldLogFile=${join(dir, "slurmctld.log")}`,
        `SlurmdLogFile=${join(dir, "slurmd.log")}`,
        "ProctrackType=proctrack/linuxproc",
        "TaskPlugin=task/none",
        "SelectType=select/cons_tres",
        "SelectTypeParameters=CR_CPU",
        "SchedulerType=sched/backfill",
        "JobAcctGatherType=jobacct_gather/none",
        "AccountingStorageType=accounting_storage/none",
        "JobCompType=jobcomp/none",
        "MpiDefault=none",
        "ReturnToService=2",
        `NodeName=${node} NodeAddr=127.0.0.1 CPUs=2 State=UNKNOWN`,
        `PartitionName=main Nodes=${node} Default=YES MaxTime=INFINITE State=UP`,
        "",
      ].join("\n"),
    );
    env = { ...process.env, SLURM_CONF: conf, FLOORCAST: `${process.execPath} ${floorcast}` };
    for (const k of Object.keys(env)) if (k.startsWith("SLURM_") && k !== "SLURM_CONF") delete env[k];
    delete env.JOB_COMPLETION_INDEX;
    startDaemon("munged", "/usr/sbin/munged", [
      "--foreground",
      "--force",
      `--socket=${socket}`,
      `--key-file=${key}`,
      `--pid-file=${join(dir, "munged.pid")}`,
      `--seed-file=${join(dir, "munged.seed")}`,
      `--log-file=${join(dir, "munged.log")}`,
    ]);
    await waitFor("munged's socket", () => existsSync(socket), 30_000, logs);
    startDaemon("slurmctld", "/usr/sbin/slurmctld", ["-D", "-i"]);
    startDaemon("slurmd", "/usr/sbin/slurmd", ["-D"]);
    const idle = (): boolean => {
      const r = spawnSync("/usr/bin/sinfo", ["-h", "-o", "%t"], { env, encoding: "utf8", timeout: 20_000 });
      return r.status === 0 && r.stdout.trim() === "idle";
    };
    await waitFor("the node to be idle", idle, 90_000, logs);
  }, 150_000);

  afterAll(async () => {
    if (jobId !== undefined) spawnSync("/usr/bin/scancel", [jobId], { env, timeout: 20_000 });
    await stopDaemons();
    rmSync(dir, { recursive: true, force: true });
  }, 60_000);

  it("sbatch --array=1-3 sample-array.sbatch writes three shards that merge byte-identical to an unsharded run", async () => {
    const out = join(dir, "out");
    const submit = spawnSync(
      "/usr/bin/sbatch",
      ["--parsable", "--array=1-3", `--chdir=${dir}`, `--output=${join(dir, "task-%a.log")}`, script, scenario, "90", "7", out],
      { env, encoding: "utf8", timeout: 30_000 },
    );
    expect(submit.status, submit.stderr).toBe(0);
    jobId = submit.stdout.trim().split(";")[0]!;
    expect(jobId).toMatch(/^\d+$/);
    const finished = (): boolean => {
      const r = spawnSync("/usr/bin/squeue", ["-h", "-j", jobId!], { env, encoding: "utf8", timeout: 20_000 });
      return r.status === 0 && r.stdout.trim() === "";
    };
    await waitFor(`array job ${jobId}`, finished, 300_000, logs);
    jobId = undefined;
    const shards = [1, 2, 3].map((k) => join(out, `shard-${k}.csv`));
    for (const [k, path] of shards.entries()) {
      expect(existsSync(path), `shard ${k + 1} missing\n${logs()}`).toBe(true);
      const taskLog = readFileSync(join(dir, `task-${k + 1}.log`), "utf8");
      // each task found its shard in the array variables and announced it
      expect(taskLog).toMatch(new RegExp(`shard ${k + 1}/3 from SLURM_ARRAY_TASK_ID=${k + 1}, SLURM_ARRAY_TASK_MIN=1`));
      expect(JSON.parse(readFileSync(path.replace(/\.csv$/, ".manifest.json"), "utf8")).shard).toMatchObject({ index: k + 1, count: 3 });
    }
    const plain = { ...env };
    const cli = (args: string[]) => spawnSync(process.execPath, [floorcast, ...args], { env: plain, encoding: "utf8", timeout: 120_000 });
    const merged = cli(["merge", ...shards.reverse(), "--out", join(dir, "merged.csv")]);
    expect(merged.status, merged.stderr).toBe(0);
    const whole = cli(["sample", "--scenario", scenario, "--n", "90", "--seed", "7", "--out", join(dir, "whole.csv")]);
    expect(whole.status, whole.stderr).toBe(0);
    expect(readFileSync(join(dir, "merged.csv")).equals(readFileSync(join(dir, "whole.csv")))).toBe(true);
    expect(readFileSync(join(dir, "merged.csv"), "utf8").trim().split("\n")).toHaveLength(91);
  }, 420_000);
});

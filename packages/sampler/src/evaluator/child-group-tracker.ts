import type { ChildProcess } from "node:child_process";

interface Tracked {
  readonly child: ChildProcess;
  readonly group: boolean;
}

const live = new Set<Tracked>();
const SIGNALS: readonly NodeJS.Signals[] = ["SIGINT", "SIGTERM", "SIGHUP"];

function signalAll(sig: NodeJS.Signals): void {
  for (const t of live) {
    try {
      if (t.group && t.child.pid !== undefined) process.kill(-t.child.pid, sig);
      else t.child.kill(sig);
    } catch {
      // already gone
    }
  }
}

const onExit = (): void => signalAll("SIGKILL");

function onSignal(sig: NodeJS.Signals): void {
  signalAll("SIGTERM");
  uninstall();
  // nobody else handles it: die of it as Node would have without our listener
  if (process.listenerCount(sig) === 0) process.kill(process.pid, sig);
}

function install(): void {
  process.on("exit", onExit);
  for (const s of SIGNALS) process.on(s, onSignal);
}

function uninstall(): void {
  process.off("exit", onExit);
  for (const s of SIGNALS) process.off(s, onSignal);
}

/**
 * Keeps a started program from outliving this process: a program run in its own process group (so that it can
 * be stopped with everything its shell started) no longer receives the terminal's Ctrl-C, so while it runs this
 * process forwards SIGINT/SIGTERM/SIGHUP to it as SIGTERM (then dies of the signal if nothing else handles it) and
 * SIGKILLs it on exit. The listeners exist only while some program is tracked.
 * @param child - the started program.
 * @param group - whether it leads its own process group (signalled as `-pid`).
 * @returns a function that stops tracking it (idempotent).
 */
export function trackChildGroup(child: ChildProcess, group: boolean): () => void {
  const t: Tracked = { child, group };
  if (live.size === 0) install();
  live.add(t);
  return () => {
    if (!live.delete(t)) return;
    if (live.size === 0) uninstall();
  };
}

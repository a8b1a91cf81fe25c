import { Worker } from "node:worker_threads";
import { runProbe, runRestart, type HyperparameterSearch, type RestartOutcome } from "./fit-hyperparameters.js";

/** One hyperparameter restart to run: the rows, the search and the start. */
export interface RestartTask {
  readonly id: number;
  readonly x: Float64Array;
  readonly y: Float64Array;
  readonly search: HyperparameterSearch;
  readonly start: Float64Array;
  /** Evaluate the likelihood at `start` only (runProbe) instead of searching from it. */
  readonly probe?: boolean;
}

/**
 * Runs one task on the calling thread: runProbe when `task.probe` is set, else runRestart.
 * @param task - the task. @returns its outcome.
 */
export function runRestartTask(task: Omit<RestartTask, "id">): RestartOutcome {
  return task.probe === true ? runProbe(task.x, task.y, task.search, task.start) : runRestart(task.x, task.y, task.search, task.start);
}

type Reply = { id: number; outcome: RestartOutcome } | { id: number; error: string };

/**
 * Runs restarts (and probes) on up to `workers` worker threads (node:worker_threads), each thread taking the next task when it
 * finishes one, and returns the outcomes in task order, so the result does not depend on which thread ran what. With
 * one worker or one task they run on the calling thread. The threads are stopped before the promise settles.
 * @param tasks - the restarts. @param workers - most threads at once (an integer ≥ 1).
 * @returns one outcome per task, in task order.
 * @throws Error when a thread fails (the others are stopped).
 */
export async function runRestartsOnWorkers(tasks: readonly Omit<RestartTask, "id">[], workers: number): Promise<RestartOutcome[]> {
  const count = Math.min(workers, tasks.length);
  if (count <= 1) return tasks.map(runRestartTask);
  const outcomes = new Array<RestartOutcome>(tasks.length);
  const threads: Worker[] = [];
  let next = 0;
  try {
    await new Promise<void>((resolve, reject) => {
      let done = 0;
      const feed = (w: Worker): void => {
        if (next >= tasks.length) return;
        const id = next++;
        w.postMessage({ id, ...tasks[id]! });
      };
      for (let k = 0; k < count; k++) {
        const w = new Worker(new URL("./restart-worker.js", import.meta.url));
        threads.push(w);
        w.on("message", (reply: Reply) => {
          if ("error" in reply) {
            reject(new Error(`fitGaussianProcessParallel: a restart failed on a worker thread: ${reply.error}`));
            return;
          }
          outcomes[reply.id] = reply.outcome;
          if (++done === tasks.length) resolve();
          else feed(w);
        });
        w.on("error", (e) => reject(new Error(`fitGaussianProcessParallel: a worker thread failed: ${e.message}`)));
        w.on("exit", (code) => {
          if (done < tasks.length) reject(new Error(`fitGaussianProcessParallel: a worker thread stopped (exit ${code})`));
        });
        feed(w);
      }
    });
  } finally {
    await Promise.all(threads.map((w) => w.terminate()));
  }
  return outcomes;
}

// Worker thread of fitGaussianProcessParallel: runs one hyperparameter restart or probe per message (runRestartTask, the
// code the serial fit runs) and posts its outcome back. Loaded by run-restarts-on-workers.ts; not part of the public API.
import { parentPort } from "node:worker_threads";
import { runRestartTask, type RestartTask } from "./run-restarts-on-workers.js";

parentPort?.on("message", (task: RestartTask) => {
  try {
    const r = runRestartTask(task);
    parentPort!.postMessage({ id: task.id, outcome: r });
  } catch (error) {
    parentPort!.postMessage({ id: task.id, error: error instanceof Error ? error.message : String(error) });
  }
});

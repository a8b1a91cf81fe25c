import { tf } from "./load-tfjs.js";

/** A CPU backend for the neural-network surrogate: WebAssembly or plain JavaScript. Never a GPU. */
export type NnBackend = "wasm" | "cpu";

/** What to ask for: a named backend, or "auto" (WebAssembly when it loads, plain CPU otherwise). */
export type NnBackendRequest = NnBackend | "auto";

let quieted = false;

/**
 * Silences tfjs's console messages (the "install the node backend" hint and debug warnings) by
 * turning on its production mode. Idempotent.
 */
function quietTf(): void {
  if (quieted) return;
  // tfjs prints its warnings only when neither IS_TEST nor PROD is set (tfjs-core backend_util.warn).
  tf.env().set("PROD", true);
  quieted = true;
}

/**
 * Selects the tfjs backend used for training and tfjs predictions. "auto" tries
 * @tensorflow/tfjs-backend-wasm (in Node it finds its .wasm files beside its own module in
 * node_modules) and falls back to the plain CPU backend when WebAssembly cannot be initialised.
 * The WebGL backend and the native tfjs-node binding are never used.
 * @param request - "wasm", "cpu" or "auto" (default).
 * @returns the backend now active.
 * @throws RangeError for an unknown request; Error when "wasm" was asked for and cannot load.
 */
export async function useNnBackend(request: NnBackendRequest = "auto"): Promise<NnBackend> {
  if (request !== "auto" && request !== "wasm" && request !== "cpu") {
    throw new RangeError(`useNnBackend: backend must be "wasm", "cpu" or "auto", got ${String(request)}`);
  }
  quietTf();
  if (request === "cpu") {
    await tf.setBackend("cpu");
    await tf.ready();
    return "cpu";
  }
  let ok = false;
  try {
    ok = await tf.setBackend("wasm");
    if (ok) await tf.ready();
  } catch {
    ok = false;
  }
  if (ok && tf.getBackend() === "wasm") return "wasm";
  if (request === "wasm") throw new Error("useNnBackend: the WebAssembly backend could not be initialised (is @tensorflow/tfjs-backend-wasm installed?)");
  await tf.setBackend("cpu");
  await tf.ready();
  return "cpu";
}

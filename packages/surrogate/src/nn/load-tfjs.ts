import type * as Tf from "@tensorflow/tfjs";

/**
 * What `@floorcast/surrogate/nn` says when the optional peer dependency @tensorflow/tfjs is not
 * installed: how to add it, and that the rest of the package works without it.
 */
export const TFJS_MISSING_MESSAGE =
  "@floorcast/surrogate/nn needs @tensorflow/tfjs, an optional peer dependency that is not installed. " +
  "Add it with: npm install @tensorflow/tfjs@^4.22.0 @tensorflow/tfjs-backend-wasm@^4.22.0 " +
  "(the WebAssembly backend is optional too; without it training runs on the plain CPU backend). " +
  "The Gaussian process (@floorcast/surrogate) and the predictor (@floorcast/surrogate/predict) do not need it.";

/** Whether `error` says that the package `name` itself (not one of its own imports) cannot be found. */
function isMissingPackage(error: unknown, name: string): boolean {
  const { code, message } = (error ?? {}) as { code?: unknown; message?: unknown };
  if (code !== "ERR_MODULE_NOT_FOUND" && code !== "MODULE_NOT_FOUND") return false;
  return typeof message === "string" && (message.includes(`'${name}'`) || message.includes(`"${name}"`));
}

/** Imports tfjs, turning a missing package into {@link TFJS_MISSING_MESSAGE}. */
async function importTfjs(): Promise<typeof Tf> {
  let tfjs: typeof Tf;
  try {
    tfjs = await import("@tensorflow/tfjs");
  } catch (error) {
    if (isMissingPackage(error, "@tensorflow/tfjs")) throw new Error(TFJS_MISSING_MESSAGE, { cause: error });
    throw error;
  }
  try {
    // Registers the WebAssembly backend (see useNnBackend); optional.
    await import("@tensorflow/tfjs-backend-wasm");
  } catch (error) {
    if (!isMissingPackage(error, "@tensorflow/tfjs-backend-wasm")) throw error;
  }
  return tfjs;
}

/**
 * The tfjs module every file of the nn subpath uses, loaded once when the subpath is first
 * imported. tfjs is an optional peer dependency of @floorcast/surrogate (so the GP and the
 * predictor install without its 280 MB); without it, importing the subpath fails with
 * {@link TFJS_MISSING_MESSAGE}.
 */
export const tf: typeof Tf = await importTfjs();

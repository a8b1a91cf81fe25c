import type { ModelFileShape } from "./model-file-shape.js";

/**
 * The payload of an "ensemble" model file: the members' own model files, combined as a uniform
 * mixture (Lakshminarayanan, Pritzel & Blundell 2017, §2.4): mean μ = (1/k) Σ μ_m and
 * sd σ = √((1/k) Σ (σ_m² + μ_m²) − μ²), with σ_m = 0 for members that give no sd.
 */
export interface EnsemblePayload {
  readonly members: readonly ModelFileShape[];
}

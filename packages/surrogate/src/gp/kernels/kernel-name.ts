/** Stationary kernel families: squared exponential, Matérn ν = 3/2, Matérn ν = 5/2 (Rasmussen & Williams 2006, §4.2). */
export type KernelName = "se" | "matern32" | "matern52";

/** Every kernel family name, in a fixed order. */
export const KERNEL_NAMES: readonly KernelName[] = ["se", "matern32", "matern52"];

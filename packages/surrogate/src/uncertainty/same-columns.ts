/**
 * Whether two models have the same inputs and the same targets, in the same order.
 * @param a - first model's column names.
 * @param b - second model's column names.
 */
export function sameColumns(
  a: { readonly inputs: readonly string[]; readonly targets: readonly string[] },
  b: { readonly inputs: readonly string[]; readonly targets: readonly string[] },
): boolean {
  const eq = (x: readonly string[], y: readonly string[]) => x.length === y.length && x.every((v, i) => v === y[i]);
  return eq(a.inputs, b.inputs) && eq(a.targets, b.targets);
}

/**
 * Ranks of a sample, 1-based, ties sharing the mean of the ranks they span ("average" ranking,
 * the convention of Spearman's rho with ties; Kendall & Gibbons, Rank Correlation Methods, ch. 3).
 * @param values - finite numbers.
 * @returns `ranks[i]` is the rank of `values[i]`.
 */
export function averageRanks(values: readonly number[]): number[] {
  const order = values.map((_, i) => i).sort((a, b) => values[a]! - values[b]!);
  const ranks = new Array<number>(values.length);
  let i = 0;
  while (i < order.length) {
    let j = i;
    while (j + 1 < order.length && values[order[j + 1]!] === values[order[i]!]) j++;
    const rank = (i + j) / 2 + 1;
    for (let k = i; k <= j; k++) ranks[order[k]!] = rank;
    i = j + 1;
  }
  return ranks;
}

import { dominates } from "./pareto-dominance.js";

/** What the sort needs of each individual: loss vector (minimised) and total constraint violation (0 = feasible). */
export interface SortableIndividual {
  readonly losses: readonly number[];
  readonly violation: number;
}

/**
 * Constrained domination (Deb et al. 2002, §VI): a feasible individual dominates an infeasible
 * one; of two infeasible ones the smaller violation dominates; two feasible ones by Pareto dominance.
 */
export function constrainedDominates(a: SortableIndividual, b: SortableIndividual): boolean {
  const fa = a.violation === 0;
  const fb = b.violation === 0;
  if (fa && fb) return dominates(a.losses, b.losses);
  if (fa) return true;
  if (fb) return false;
  return a.violation < b.violation;
}

/**
 * Fast non-dominated sort (Deb, Pratap, Agarwal & Meyarivan 2002, IEEE TEC 6(2), §III-A) under
 * constrained domination: O(M N²).
 * @param pop - individuals.
 * @returns fronts as index lists, best first.
 */
export function fastNonDominatedSort(pop: readonly SortableIndividual[]): number[][] {
  const n = pop.length;
  const dominated: number[][] = Array.from({ length: n }, () => []);
  const count = new Array<number>(n).fill(0);
  const fronts: number[][] = [[]];
  for (let p = 0; p < n; p++) {
    for (let q = p + 1; q < n; q++) {
      if (constrainedDominates(pop[p]!, pop[q]!)) {
        dominated[p]!.push(q);
        count[q]!++;
      } else if (constrainedDominates(pop[q]!, pop[p]!)) {
        dominated[q]!.push(p);
        count[p]!++;
      }
    }
  }
  for (let p = 0; p < n; p++) if (count[p] === 0) fronts[0]!.push(p);
  for (let i = 0; fronts[i]!.length > 0; i++) {
    const next: number[] = [];
    for (const p of fronts[i]!) {
      for (const q of dominated[p]!) if (--count[q]! === 0) next.push(q);
    }
    fronts.push(next);
  }
  fronts.pop();
  return fronts;
}

/**
 * Crowding distance of the members of one front (Deb et al. 2002, §III-B): per objective, sort,
 * give the extremes Infinity and the others the normalised gap between their neighbours; sum.
 * @param losses - loss vectors of the front's members.
 * @returns one distance per member.
 */
export function crowdingDistance(losses: readonly (readonly number[])[]): number[] {
  const n = losses.length;
  const dist = new Array<number>(n).fill(0);
  if (n === 0) return dist;
  const m = losses[0]!.length;
  for (let k = 0; k < m; k++) {
    const order = Array.from({ length: n }, (_, i) => i).sort((a, b) => losses[a]![k]! - losses[b]![k]!);
    const lo = losses[order[0]!]![k]!;
    const hi = losses[order[n - 1]!]![k]!;
    dist[order[0]!] = Infinity;
    dist[order[n - 1]!] = Infinity;
    if (hi === lo) continue;
    for (let j = 1; j < n - 1; j++) {
      dist[order[j]!]! += (losses[order[j + 1]!]![k]! - losses[order[j - 1]!]![k]!) / (hi - lo);
    }
  }
  return dist;
}

import { UNREACHABLE } from "./constants";
import type { CostMatrix } from "./cost-matrix";
import { arcCost } from "./cost-matrix";

/**
 * A cheap lower bound for start → every stop once → end: each stop and the end is entered exactly
 * once, and the start and each stop is left exactly once, so the walk costs at least the sum of the
 * cheapest way into each (or out of each). Weak, but always available and O(m²).
 */
export function degreeBound(cm: CostMatrix, start: number, end: number, stops: readonly number[]): number {
  if (stops.length === 0) return start === end ? 0 : arcCost(cm, start, end);
  const into = [...stops, end];
  const outOf = [start, ...stops];
  let inSum = 0;
  for (const b of into) {
    let best = UNREACHABLE;
    for (const a of outOf) if (a !== b) best = Math.min(best, arcCost(cm, a, b));
    inSum += best;
  }
  let outSum = 0;
  for (const a of outOf) {
    let best = UNREACHABLE;
    for (const b of into) if (a !== b) best = Math.min(best, arcCost(cm, a, b));
    outSum += best;
  }
  return Math.max(inSum, outSum);
}

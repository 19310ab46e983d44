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
  const inSum = cheapestSum(into, (b) => outOf.map((a) => (a === b ? UNREACHABLE : arcCost(cm, a, b))));
  const outSum = cheapestSum(outOf, (a) => into.map((b) => (a === b ? UNREACHABLE : arcCost(cm, a, b))));
  return Math.max(inSum, outSum);
}

/** Sum over points of the cheapest of each point's candidate arcs. */
function cheapestSum(points: readonly number[], arcs: (p: number) => number[]): number {
  return points.reduce((sum, p) => sum + Math.min(UNREACHABLE, ...arcs(p)), 0);
}

import { UNREACHABLE } from "./constants";
import { CostOverflowError } from "./errors";

/** Square, possibly asymmetric arc costs; cost[from * n + to], UNREACHABLE for no arc. */
export interface CostMatrix {
  n: number;
  cost: Int32Array;
}

export function arcCost(cm: CostMatrix, from: number, to: number): number {
  const c = cm.cost[from * cm.n + to];
  return c === undefined || c >= UNREACHABLE ? UNREACHABLE : c;
}

/** Length of start → order… → end, or UNREACHABLE if any leg has no arc. */
export function walkLength(cm: CostMatrix, start: number, order: readonly number[], end: number): number {
  if (order.length === 0) return start === end ? 0 : arcCost(cm, start, end);
  let total = 0;
  let at = start;
  for (const s of [...order, end]) {
    const c = arcCost(cm, at, s);
    if (c >= UNREACHABLE) return UNREACHABLE;
    total += c;
    at = s;
  }
  return total >= UNREACHABLE ? UNREACHABLE : total;
}

/**
 * Refuses inputs whose worst tour could overflow: the sum of each point's largest finite
 * outgoing cost bounds every simple walk through those points.
 */
export function assertNoOverflow(cm: CostMatrix, points: readonly number[]): void {
  let bound = 0;
  for (const a of points) {
    let worst = 0;
    for (const b of points) {
      const c = a === b ? 0 : arcCost(cm, a, b);
      if (c < 0) throw new RangeError(`negative cost ${c} from ${a} to ${b}`);
      if (c < UNREACHABLE && c > worst) worst = c;
    }
    bound += worst;
  }
  if (bound >= UNREACHABLE) throw new CostOverflowError(bound);
}

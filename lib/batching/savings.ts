import { CartLoad } from "./cart-load";
import type { PreparedOrder } from "./prepare";
import type { CartLimits } from "./types";
import type { WalkCosts } from "./walk-costs";

export type SavingsOptions = {
  /**
   * Cut-offs up to this many minutes after the seed's count as the seed's cut-off window. Default 0:
   * only orders with the very same cut-off (the same carrier collection) compete on walking.
   */
  cutoffSlackMinutes?: number;
  /**
   * Per step, price at most this many fitting orders of a window, most urgent first. Bounds the work
   * at batches × totes × lookahead insertions even when a whole wave shares one cut-off. Default 200.
   */
  lookahead?: number;
};

/**
 * Route savings, one batch at a time. The seed is the most urgent order left; then, while the cart
 * has room, add the order that lengthens the batch's walk least.
 *
 * Cut-off rule: candidates come from the seed's cut-off window first. Only when no order left in that
 * window fits the cart is it topped up from the next window (the next later cut-off), and so on. So an
 * order never loses a tote to an order with a later cut-off that it could have taken, batches come out
 * in cut-off order like first-come, and carts are still filled as full as first-come fills them.
 *
 * "Lengthens least" is priced by cheapest insertion of the order's new stops into the batch's running
 * insertion route (see InsertionRoute): O(stops) per candidate instead of re-solving the route, which
 * keeps a 1,000-order wave to well under a second of grouping. Ties go to the more urgent order.
 */
export function* savingsBatches(
  queue: readonly PreparedOrder[],
  costs: WalkCosts,
  limits: CartLimits,
  options: SavingsOptions = {},
): Generator<PreparedOrder[]> {
  const slackMs = (options.cutoffSlackMinutes ?? 0) * 60_000;
  const lookahead = Math.max(1, options.lookahead ?? 200);
  const taken = new Uint8Array(queue.length);
  let head = 0;
  let left = queue.length;
  while (left > 0) {
    while (taken[head]) head++;
    const seed = queue[head] as PreparedOrder;
    taken[head] = 1;
    left--;
    if (seed.alone) {
      yield [seed];
      continue;
    }
    const cart = new CartLoad(costs, limits);
    cart.add(seed);
    const windowEnd = seed.cutoffMs + slackMs;
    while (!cart.full && left > 0) {
      const pick = cheapestAddition(queue, taken, head, cart, windowEnd, lookahead);
      if (pick < 0) break;
      taken[pick] = 1;
      left--;
      cart.add(queue[pick] as PreparedOrder);
    }
    yield cart.orders;
  }
}

/** Index of the fitting order of the earliest window with any, that adds the least walking; -1 if none fits. */
function cheapestAddition(
  queue: readonly PreparedOrder[],
  taken: Uint8Array,
  head: number,
  cart: CartLoad,
  windowEnd: number,
  lookahead: number,
): number {
  let tier: number | undefined;
  let best = -1;
  let bestAdded = Infinity;
  let priced = 0;
  for (let i = head; i < queue.length; i++) {
    if (taken[i]) continue;
    const o = queue[i] as PreparedOrder;
    // The queue is sorted by cut-off, so windows are contiguous runs of it.
    const oTier = o.cutoffMs <= windowEnd ? windowEnd : o.cutoffMs;
    if (oTier !== tier) {
      if (best >= 0) return best;
      tier = oTier;
      priced = 0;
    }
    if (priced >= lookahead || o.alone || !cart.fits(o)) continue;
    const added = cart.route.addedLength(o.points);
    if (added === Infinity) continue;
    priced++;
    if (added < bestAdded) {
      bestAdded = added;
      best = i;
      if (added === 0) return best;
    }
  }
  return best;
}

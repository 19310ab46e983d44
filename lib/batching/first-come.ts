import { CartLoad } from "./cart-load";
import type { PreparedOrder } from "./prepare";
import type { CartLimits } from "./types";
import type { WalkCosts } from "./walk-costs";

/**
 * First-come: walk the queue (already in cut-off, priority, number order) and fill the cart while the
 * next order fits; the first order that does not fit starts the next cart. Yields one batch at a time.
 */
export function* firstComeBatches(
  queue: readonly PreparedOrder[],
  costs: WalkCosts,
  limits: CartLimits,
): Generator<PreparedOrder[]> {
  let cart = new CartLoad(costs, limits);
  for (const o of queue) {
    const fits = !o.alone && cart.fits(o) && cart.route.addedLength(o.points) < Infinity;
    if (!fits && cart.orders.length > 0) {
      yield cart.orders;
      cart = new CartLoad(costs, limits);
    }
    if (o.alone) yield [o];
    else cart.add(o);
  }
  if (cart.orders.length > 0) yield cart.orders;
}

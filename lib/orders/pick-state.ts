import type { OrderStatus, PickState } from "@/lib/contracts/orders";

// Pure: the orders list, the order page and the short-pick list all derive an order's picking state
// here from counts of its lines, so they never disagree.

/** An order's own lines by pick state and follow-up. */
export type LineCounts = {
  open: number;
  picked: number;
  shortOpen: number;
  shortRepick: number;
  shortCancel: number;
};

/**
 * The re-pick orders of the same original (a re-pick of a re-pick counts from the original too):
 * lines not yet settled (not picked, or short with no follow-up yet) and lines cancelled.
 */
export type FamilyCounts = { unsettled: number; cancelled: number };

export const NO_FAMILY: FamilyCounts = { unsettled: 0, cancelled: 0 };

export function pickState(status: OrderStatus, own: LineCounts, family: FamilyCounts = NO_FAMILY): PickState | null {
  if (status !== "released") return null;
  if (own.open > 0) return own.picked + own.shortOpen + own.shortRepick + own.shortCancel > 0 ? "picking" : "to-pick";
  if (own.shortOpen > 0) return "short";
  if (own.shortRepick > 0) {
    if (family.unsettled > 0) return "awaiting-repick";
    return own.shortCancel > 0 || family.cancelled > 0 ? "completed-short" : "picked";
  }
  return own.shortCancel > 0 ? "completed-short" : "picked";
}

/** Done with: nothing more will be picked for it. */
export const isSettled = (s: PickState | null) => s === "picked" || s === "completed-short";

/** A cut-off that has passed on an order that is not done with yet. */
export function isOverdue(cutoffAt: string | null, state: PickState | null, now: Date): boolean {
  return cutoffAt !== null && new Date(cutoffAt).getTime() < now.getTime() && !isSettled(state);
}

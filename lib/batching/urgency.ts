import type { WaveOrder } from "./types";

/** Cut-off as epoch ms; no cut-off sorts after every dated one. NaN for a string that is not a date. */
export function cutoffMs(order: Pick<WaveOrder, "cutoffAt">): number {
  return order.cutoffAt === null ? Infinity : Date.parse(order.cutoffAt);
}

type Ranked = { cutoffMs: number; order: Pick<WaveOrder, "priority" | "orderNumber" | "orderId"> };

/**
 * The first-come queue: earliest cut-off first (none last), then priority (1 first), then order
 * number and id so equal orders still sort the same way every time.
 */
export function compareUrgency(a: Ranked, b: Ranked): number {
  if (a.cutoffMs !== b.cutoffMs) return a.cutoffMs < b.cutoffMs ? -1 : 1;
  if (a.order.priority !== b.order.priority) return a.order.priority - b.order.priority;
  if (a.order.orderNumber !== b.order.orderNumber) return a.order.orderNumber < b.order.orderNumber ? -1 : 1;
  return a.order.orderId - b.order.orderId;
}

// Pure: what a compared plan's table row says, from its stored batches and each order's own trip.
import { estimateSeconds, type SiteTiming } from "@/lib/batching/estimate";
import type { StoredBatch } from "@/lib/contracts/batches";
import type { WavePlanSummary } from "@/lib/contracts/wave-plans";

export type PerOrder = Map<number, { distanceMm: number; lines: number; optimal: boolean }>;

/** Each order's own trip, from the single-order batches (one order, so every line of a batch is that order's). */
export function perOrderTrips(stored: StoredBatch[], orderOfLine: Map<number, number>): PerOrder {
  const trips: PerOrder = new Map();
  for (const b of stored) {
    const orderId = orderOfLine.get(b.lines[0]?.orderLineId ?? -1);
    if (orderId !== undefined) trips.set(orderId, { distanceMm: b.distanceMm, lines: b.lineCount, optimal: b.optimal });
  }
  return trips;
}

/** Batching and routing sum; so do the estimates, batch by batch and order by order (one set-up each, once the estimate has one). */
export function summarisePlan(
  stored: StoredBatch[],
  unbatched: number,
  trips: PerOrder,
  orderOfLine: Map<number, number>,
  timing: SiteTiming,
): WavePlanSummary {
  const batched = new Set(stored.flatMap((b) => b.lines.map((l) => orderOfLine.get(l.orderLineId) as number)));
  let orderByOrderMm = 0;
  let orderByOrderSeconds = 0;
  let orderByOrderOptimal = true;
  for (const id of batched) {
    const t = trips.get(id);
    if (!t) throw new Error(`order ${id} could be batched but not walked on its own; plan the wave instead`);
    orderByOrderMm += t.distanceMm;
    orderByOrderSeconds += estimateSeconds({ distanceMm: t.distanceMm, lines: t.lines }, timing);
    orderByOrderOptimal &&= t.optimal;
  }
  return {
    batches: stored.length,
    orders: batched.size,
    lines: stored.reduce((a, b) => a + b.lineCount, 0),
    totes: stored.reduce((a, b) => a + b.toteCount, 0),
    unbatchedOrders: unbatched,
    distanceMm: stored.reduce((a, b) => a + b.distanceMm, 0),
    usualWalkMm: stored.reduce((a, b) => a + b.baselineMm, 0),
    orderByOrderMm,
    orderByOrderOptimal,
    estimatedSeconds: stored.reduce(
      (a, b) => a + estimateSeconds({ distanceMm: b.distanceMm, lines: b.lineCount }, timing),
      0,
    ),
    orderByOrderSeconds,
    timing: {
      walkingSpeedMmPerS: timing.walkingSpeedMmPerS,
      secondsPerLine: timing.secondsPerLine,
      setupSecondsPerBatch: timing.setupSecondsPerBatch ?? 0,
    },
  };
}

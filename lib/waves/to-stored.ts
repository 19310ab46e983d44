import type { CompactGraph } from "@/lib/routing/graph";
import type { BatchPlan, WaveOrder } from "@/lib/batching/types";
import type { StoredBatch } from "@/lib/contracts/batches";

/** A planned batch as rows: stops in walking order, each order line at its stop and in its tote. */
export function toStoredBatch(graph: CompactGraph, plan: BatchPlan, ordersById: Map<number, WaveOrder>): StoredBatch {
  const apOfCode = new Map(graph.bins.map((b) => [b.code, b.accessPoint]));
  const seqOfAp = new Map(plan.route.stops.map((s, i) => [s.accessPoint.id, i + 1]));
  const lines: StoredBatch["lines"] = [];
  plan.orders.forEach((orderId, toteIndex) => {
    for (const line of ordersById.get(orderId)?.lines ?? []) {
      const ap = apOfCode.get(line.binCode);
      const seq = ap === undefined ? undefined : seqOfAp.get(ap);
      if (seq === undefined) throw new Error(`line ${line.lineId} (${line.binCode}) has no stop in its batch's route`);
      lines.push({ orderLineId: line.lineId, stopSeq: seq, tote: toteIndex + 1, binCode: line.binCode });
    }
  });
  return {
    lineCount: plan.lineCount,
    toteCount: plan.orders.length,
    weightG: plan.weightG,
    distanceMm: plan.route.lengthMm,
    baselineMm: plan.route.baselineMm,
    lowerBoundMm: plan.route.lowerBoundMm,
    optimal: plan.route.optimal,
    method: plan.route.method,
    stops: plan.route.stops.map((s) => ({ accessPoint: s.accessPoint.id, x: s.accessPoint.x, y: s.accessPoint.y })),
    lines,
  };
}

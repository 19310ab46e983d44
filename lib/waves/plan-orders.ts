import "server-only";
import type { CompactGraph } from "@/lib/routing/graph";
import type { DistanceMatrix } from "@/lib/routing/floyd-warshall";
import type { WaveOrder } from "@/lib/batching/types";
import type { StoredBatch } from "@/lib/contracts/batches";
import type { UnbatchableOrder, WaveSettings } from "@/lib/contracts/waves";
import { wavePool } from "@/lib/workers/pools";
import { toStoredBatch } from "./to-stored";

export type PlanSettings = Pick<
  WaveSettings,
  "method" | "totesPerCart" | "maxLines" | "maxWeightG" | "depotId" | "dropoffId"
>;

export type PlannedOrders = {
  stored: StoredBatch[];
  /** Planned walk and the usual walk of the same batches, summed over them. */
  totals: { distanceMm: number; baselineMm: number };
  unbatchable: UnbatchableOrder[];
};

/**
 * Plans these orders with these settings in the wave worker: batches as storePlan takes them, their
 * totals, and the orders no batch holds (with their numbers). The plan job and the plan comparison
 * both come through here, so a compared plan is the plan the plan job would have made.
 */
export async function planOrders(
  layout: { graph: CompactGraph; matrix: DistanceMatrix },
  orders: WaveOrder[],
  s: PlanSettings,
  opts: { signal?: AbortSignal; onProgress?: (fraction: number) => void } = {},
): Promise<PlannedOrders> {
  const { graph, matrix } = layout;
  const result = await wavePool().run(
    {
      graph,
      matrix,
      orders,
      limits: { totesPerCart: s.totesPerCart, maxLines: s.maxLines, maxWeightG: s.maxWeightG },
      method: s.method,
      from: s.depotId,
      to: s.dropoffId,
    },
    { signal: opts.signal, onProgress: opts.onProgress },
  );
  const byId = new Map(orders.map((o) => [o.orderId, o]));
  const stored = result.batches.map((b) => toStoredBatch(graph, b, byId));
  return {
    stored,
    totals: {
      distanceMm: stored.reduce((a, b) => a + b.distanceMm, 0),
      baselineMm: stored.reduce((a, b) => a + b.baselineMm, 0),
    },
    unbatchable: result.unbatchable.map((u) => ({ ...u, orderNumber: byId.get(u.orderId)?.orderNumber })),
  };
}

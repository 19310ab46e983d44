import type { BatchSummaryDTO, StoredBatch } from "@/lib/contracts/batches";
import type { RouteMethod } from "@/lib/routing/certificate";
import { certificateText, isProved, METHOD_NAMES } from "@/lib/routing/certificate";

// Pure: one batches row to and from what the wave pages and the planning job hold. The certificate
// is worked out here from the stored length, bound and method, so every page says the same.

function routeMethod(v: unknown): RouteMethod {
  const m = String(v);
  if (!Object.hasOwn(METHOD_NAMES, m)) throw new Error(`batch row holds an unknown route method “${m}”`);
  return m as RouteMethod;
}

/** The columns storePlan writes for one planned batch. */
export function batchRowOf(waveId: number, number: number, b: StoredBatch) {
  return {
    wave_id: waveId,
    number,
    line_count: b.lineCount,
    tote_count: b.toteCount,
    weight_g: b.weightG,
    distance_mm: b.distanceMm,
    baseline_mm: b.baselineMm,
    lower_bound_mm: b.lowerBoundMm,
    optimal: isProved({ lengthMm: b.distanceMm, lowerBoundMm: b.lowerBoundMm }),
    method: b.method,
  };
}

/** A batches row with its stop and line counts (listBatches' select) as the pages show it. */
export function batchSummaryOf(r: Record<string, unknown>): BatchSummaryDTO {
  const distanceMm = Number(r.distance_mm);
  const lowerBoundMm = Number(r.lower_bound_mm);
  const method = routeMethod(r.method);
  return {
    id: Number(r.id),
    number: Number(r.number),
    lineCount: Number(r.line_count),
    toteCount: Number(r.tote_count),
    weightG: Number(r.weight_g),
    stopCount: Number(r.stop_count),
    distanceMm,
    baselineMm: Number(r.baseline_mm),
    lowerBoundMm,
    optimal: isProved({ lengthMm: distanceMm, lowerBoundMm }),
    method,
    certificate: certificateText({ method, lengthMm: distanceMm, lowerBoundMm }),
    status: String(r.status),
    pickedLines: Number(r.picked_count),
    shortLines: Number(r.short_count),
  };
}

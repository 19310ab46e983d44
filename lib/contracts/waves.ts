// What the waves API and pages hand the browser, and what db/waves.ts returns. Types only: the
// client imports this file, so it stays free of server code.

export type WaveSettings = {
  totesPerCart: number;
  maxLines: number;
  maxWeightG: number;
  depotId: string;
  dropoffId: string;
  method: "first-come" | "savings";
};

export type WaveStatus = "draft" | "planned" | "released";

export type UnbatchableOrder = { orderId: number; orderNumber?: string; reason: string };

export type WaveDTO = {
  id: number;
  name: string;
  status: WaveStatus;
  version: number;
  layoutVersionId: number;
  layoutVersionNumber: number;
  floorPlanId: number;
  floorPlanName: string;
  settings: WaveSettings;
  orderCount: number;
  batchCount: number;
  distanceMm: number | null;
  baselineMm: number | null;
  unbatchable: UnbatchableOrder[];
  createdAt: string;
  plannedAt: string | null;
  releasedAt: string | null;
  releasedBy: string | null;
};

/**
 * Which open orders a wave takes. With a cut-off, orders that have none are left out unless
 * includeNoCutoff says to take them too (the preview counts them either way, so none go unseen).
 */
export type WaveFilter = { cutoffBefore?: Date; priorities?: number[]; includeNoCutoff?: boolean };

export type WavePreviewDTO = {
  /** What starting a wave with this filter takes now. */
  orders: number;
  lines: number;
  /** Open orders of the ticked priorities that have no cut-off, whether the filter takes them or not. */
  ordersWithoutCutoff: number;
  /** Lines whose item has no bin on the layout version: their orders cannot be batched on it. */
  offLayout: { orders: number; lines: number; examples: { orderNumber: string; sku: string; binCodes: string[] }[] };
};

/** A line a picker could not fill completely: the planner's follow-up list. */
export type ShortPickDTO = {
  batchNumber: number;
  orderNumber: string;
  binCode: string;
  sku: string;
  ordered: number;
  picked: number;
  reason: string | null;
  at: string | null;
};

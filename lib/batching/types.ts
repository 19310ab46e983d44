import type { PickPlan } from "@/lib/routing/plan";

/** One line of an order: what to pick, from which bin, how many. */
export type WaveLine = {
  lineId: number;
  sku: string;
  binCode: string;
  /** When no bin of the item is on the wave's layout version (binCode ""): the item master's bins, by rank, for the reason. */
  itemBins?: string[];
  /** In the item's unit of measure; metres may be fractional. */
  quantity: number;
  unitWeightG: number;
};

export type WaveOrder = {
  orderId: number;
  orderNumber: string;
  /** ISO date-time the order must be packed by (carrier collection), or null for no cut-off. */
  cutoffAt: string | null;
  /** 1 = most urgent. */
  priority: number;
  lines: WaveLine[];
};

/**
 * What one cart carries. One order goes into one tote (common practice for pick-to-tote batching),
 * so a batch holds at most totesPerCart orders; lines and weight are summed over its orders.
 */
export type CartLimits = {
  totesPerCart: number;
  maxLines: number;
  maxWeightG: number;
};

export type BatchPlan = {
  /** Order ids; tote i holds orders[i]. */
  orders: number[];
  lineCount: number;
  weightG: number;
  route: PickPlan;
};

export type BatchingMethod = "first-come" | "savings";

export type UnbatchableOrder = {
  orderId: number;
  /** A sentence a planner can act on. */
  reason: string;
};

export type BatchingResult = {
  batches: BatchPlan[];
  unbatchable: UnbatchableOrder[];
};

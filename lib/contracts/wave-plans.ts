// Plans of one wave compared on the same orders, as GET /api/waves/[id]/plans hands them over. Types only.
import type { WaveSettings, WaveStatus } from "./waves";

/** One way to plan the wave: the form's row. Depot and drop-off stay the wave's, so every plan walks the same ends. */
export type PlanVariant = {
  method: WaveSettings["method"];
  totesPerCart: number;
  maxLines: number;
  maxWeightG: number;
};

export type WavePlanSummary = {
  batches: number;
  /** Orders the plan's batches hold, and their lines. */
  orders: number;
  lines: number;
  totes: number;
  /** Orders no batch of this plan holds (too big for its carts, off the layout…). */
  unbatchedOrders: number;
  distanceMm: number;
  /** The usual walk: the same batches walked in the site's usual bin order. */
  usualWalkMm: number;
  /** The same orders picked one per trip, depot to drop-off, each on its shortest route. */
  orderByOrderMm: number;
  /** Order-by-order trips whose route was proved shortest (all of them for orders up to the exact limit). */
  orderByOrderOptimal: boolean;
  estimatedSeconds: number;
  orderByOrderSeconds: number;
  /** The figures the two estimates used. */
  timing: { walkingSpeedMmPerS: number; secondsPerLine: number; setupSecondsPerBatch: number };
};

export type WavePlanDTO = {
  id: number;
  label: string;
  settings: WaveSettings;
  summary: WavePlanSummary;
  waveVersion: number;
  /** Computed for the wave as it stands now (and the wave is not released): it can be kept. */
  current: boolean;
  /** The wave's batches are this plan's (kept, and nothing changed since). */
  kept: boolean;
  createdAt: string;
  createdBy: string | null;
};

export type WavePlansDTO = {
  wave: { id: number; version: number; status: WaveStatus };
  plans: WavePlanDTO[];
};

export const MAX_PLAN_VARIANTS = 4;

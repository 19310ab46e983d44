// A wave's batches as the wave pages, the pick lists and db/batches.ts see them. Types only.
import type { RouteMethod } from "@/lib/routing/certificate";

export type BatchSummaryDTO = {
  id: number;
  number: number;
  lineCount: number;
  toteCount: number;
  weightG: number;
  stopCount: number;
  distanceMm: number;
  baselineMm: number;
  /** Never above the shortest possible walk; 0 when no bound is known, distanceMm when proved shortest. */
  lowerBoundMm: number;
  /** The bound reaches the walk: no shorter walk exists. */
  optimal: boolean;
  method: RouteMethod;
  /** The route's certificate in plain words (certificateText), as the pages print it. */
  certificate: string;
  status: string;
  pickedLines: number;
  shortLines: number;
};

export type BatchStopLine = {
  orderNumber: string;
  tote: number;
  sku: string;
  description: string;
  quantity: number;
  uom: string;
  binCode: string;
  unitWeightG: number;
};

export type BatchDetailDTO = BatchSummaryDTO & {
  stops: { seq: number; x: number; y: number; accessPoint: number; lines: BatchStopLine[] }[];
};

/** One planned batch as the planning job stores it. */
export type StoredBatch = {
  lineCount: number;
  toteCount: number;
  weightG: number;
  distanceMm: number;
  baselineMm: number;
  /** Never above the shortest possible walk (PickPlan.lowerBoundMm). */
  lowerBoundMm: number;
  optimal: boolean;
  method: RouteMethod;
  stops: { accessPoint: number; x: number; y: number }[];
  lines: { orderLineId: number; stopSeq: number; tote: number; binCode: string }[];
};

// The short-pick follow-up list of a shift and the bins flagged for replenishment. Types and constants
// only: the client imports this file.

/** What the shift does about a short pick: the two line outcomes, and flagging the bin (which can go with either). */
export const FOLLOW_UP_ACTIONS = ["repick", "cancel", "replenish"] as const;
export type FollowUpAction = (typeof FOLLOW_UP_ACTIONS)[number];

export const FOLLOW_UP_LABEL: Record<FollowUpAction, string> = {
  repick: "Re-pick later",
  cancel: "Cancel the rest of the line",
  replenish: "Flag the bin for replenishment",
};

export type ShortPickRowDTO = {
  /** The order line's id: the follow-up route's [lineId]. */
  lineId: number;
  orderId: number;
  orderNumber: string;
  waveId: number;
  waveName: string;
  batchNumber: number;
  sku: string;
  binCode: string;
  ordered: number;
  picked: number;
  short: number;
  reason: string | null;
  pickerName: string | null;
  at: string | null;
  followUp: "repick" | "cancel" | null;
  followUpByName: string | null;
  followUpAt: string | null;
  repickOrder: { id: number; orderNumber: string } | null;
  /** When someone flagged the bin from this line. */
  replenishAt: string | null;
  version: number;
};

export type ReplenishmentDTO = {
  id: number;
  binCode: string;
  sku: string | null;
  requestedByName: string | null;
  requestedAt: string;
  version: number;
};

export type ShortPicksDTO = {
  /** The shift's day in the site's time zone, YYYY-MM-DD. */
  date: string;
  shortPicks: ShortPickRowDTO[];
  /** Waves with a short pick that day, for the filter. */
  waves: { id: number; name: string }[];
  /** Every bin whose replenishment flag is up, whatever day it was raised. */
  replenishments: ReplenishmentDTO[];
};

// Orders as the orders API (GET /api/orders) lists them. The statuses are a value too: the handler
// validates its ?status= against them.

export const ORDER_STATUSES = ["open", "planned", "released"] as const;
export type OrderStatus = (typeof ORDER_STATUSES)[number];

/**
 * How far a released order's picking has got, derived from its lines (never stored, so it cannot
 * drift from them): `short` means picked short and nobody has chosen a follow-up yet.
 */
export const PICK_STATES = ["to-pick", "picking", "picked", "short", "awaiting-repick", "completed-short"] as const;
export type PickState = (typeof PICK_STATES)[number];

export const PICK_STATE_LABEL: Record<PickState, string> = {
  "to-pick": "Not started",
  picking: "Being picked",
  picked: "Picked",
  short: "Picked short: follow-up needed",
  "awaiting-repick": "Awaiting re-pick",
  "completed-short": "Completed short",
};

export type OrderDTO = {
  id: number;
  orderNumber: string;
  customerRef: string | null;
  priority: number;
  cutoffAt: string | null;
  status: OrderStatus;
  lineCount: number;
  note: string | null;
  /** Null until the order is in a released wave. */
  pickState: PickState | null;
  /** Its cut-off has passed and it is not fully picked (or settled short). */
  overdue: boolean;
  /** A re-pick order's original. */
  parent: { id: number; orderNumber: string } | null;
};

export type OrderLineDTO = {
  id: number;
  lineNo: number;
  sku: string;
  description: string;
  quantity: number;
  /** The bin the batch picks it from, or the item's first pick bin while it is in no batch. */
  binCode: string | null;
  batch: { id: number; number: number; waveId: number; waveName: string } | null;
  pickStatus: "open" | "picked" | "short" | null;
  pickedQty: number | null;
  shortReason: string | null;
  followUp: "repick" | "cancel" | null;
  repickOrder: { id: number; orderNumber: string } | null;
  replenishFlagged: boolean;
  /** A re-pick order's line: the line whose remainder it carries. */
  repickOf: { orderId: number; orderNumber: string; lineNo: number } | null;
};

export type OrderDetailDTO = OrderDTO & {
  wave: { id: number; name: string } | null;
  lines: OrderLineDTO[];
  repickOrders: { id: number; orderNumber: string; status: OrderStatus; pickState: PickState | null }[];
};

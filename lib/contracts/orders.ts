// Orders as the orders API (GET /api/orders) lists them. The statuses are a value too: the handler
// validates its ?status= against them.

export const ORDER_STATUSES = ["open", "planned", "released"] as const;
export type OrderStatus = (typeof ORDER_STATUSES)[number];

export type OrderDTO = {
  id: number;
  orderNumber: string;
  customerRef: string | null;
  priority: number;
  cutoffAt: string | null;
  status: OrderStatus;
  lineCount: number;
  note: string | null;
};

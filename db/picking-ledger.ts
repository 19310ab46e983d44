import "server-only";
import { db } from "./knex";
import { chunks } from "./rows";

/** A stored confirmation as the check after a load run sees it: whom it answered what, for which line. */
export type StoredConfirmation = {
  key: string;
  batchId: number;
  userId: string;
  status: number;
  orderLineId: number | null;
};
/** A batch line's pick state. */
export type StoredPickLine = {
  batchId: number;
  orderLineId: number;
  quantity: number;
  pickStatus: "open" | "picked" | "short";
  pickedQty: number | null;
  confirmedBy: string | null;
};

const CHUNK = 500;

/**
 * Every confirmation and every line of the given batches, read straight from the tables, so that a
 * load run can compare what the handhelds were told with what was stored.
 */
export async function pickLedger(
  batchIds: readonly number[],
): Promise<{ confirmations: StoredConfirmation[]; lines: StoredPickLine[] }> {
  const confirmations: StoredConfirmation[] = [];
  const lines: StoredPickLine[] = [];
  for (const ids of chunks(batchIds, CHUNK)) {
    const c = await db()("pick_confirmations")
      .whereIn("batch_id", ids)
      .select(
        "idempotency_key",
        "batch_id",
        "user_id",
        db().raw("json_value(response, '$.status') as status"),
        db().raw("json_value(response, '$.body.line.orderLineId') as order_line_id"),
      );
    for (const r of c)
      confirmations.push({
        key: r.idempotency_key,
        batchId: Number(r.batch_id),
        userId: r.user_id,
        status: Number(r.status),
        orderLineId: r.order_line_id === null ? null : Number(r.order_line_id),
      });
    const l = await db()("batch_lines as bl")
      .join("order_lines as ol", "ol.id", "bl.order_line_id")
      .whereIn("bl.batch_id", ids)
      .select("bl.batch_id", "bl.order_line_id", "ol.quantity", "bl.pick_status", "bl.picked_qty", "bl.confirmed_by");
    for (const r of l)
      lines.push({
        batchId: Number(r.batch_id),
        orderLineId: Number(r.order_line_id),
        quantity: Number(r.quantity),
        pickStatus: r.pick_status,
        pickedQty: r.picked_qty === null ? null : Number(r.picked_qty),
        confirmedBy: r.confirmed_by,
      });
  }
  return { confirmations, lines };
}

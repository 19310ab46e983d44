import "server-only";
import type { Knex } from "knex";
import { db } from "./knex";
import { iso } from "./rows";
import type { ShortPickDTO } from "@/lib/contracts/waves";

/**
 * Lines a picker could not fill completely, by batch and stop: the planner's follow-up list on the
 * wave page and in the summary mail. Pass the transaction when the answer must see its own writes.
 */
export async function shortPicksOfWave(waveId: number, q: Knex | Knex.Transaction = db()): Promise<ShortPickDTO[]> {
  const rows = await q("batch_lines as bl")
    .join("batches as b", "b.id", "bl.batch_id")
    .join("order_lines as l", "l.id", "bl.order_line_id")
    .join("orders as o", "o.id", "l.order_id")
    .join("items as i", "i.id", "l.item_id")
    .where({ "b.wave_id": waveId, "bl.pick_status": "short" })
    .select(
      "b.number",
      "o.order_number",
      "bl.bin_code",
      "i.sku",
      "l.quantity",
      "bl.picked_qty",
      "bl.short_reason",
      "bl.confirmed_at",
    )
    .orderBy([{ column: "b.number" }, { column: "bl.stop_seq" }]);
  return rows.map(
    (r: {
      number: number;
      order_number: string;
      bin_code: string;
      sku: string;
      quantity: number;
      picked_qty: number | null;
      short_reason: string | null;
      confirmed_at: Date | null;
    }) => ({
      batchNumber: r.number,
      orderNumber: r.order_number,
      binCode: r.bin_code,
      sku: r.sku,
      ordered: r.quantity,
      picked: r.picked_qty ?? 0,
      reason: r.short_reason,
      at: iso(r.confirmed_at),
    }),
  );
}

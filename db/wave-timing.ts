import "server-only";
import { db } from "./knex";

/** The earliest cut-off among the orders in the wave's batches (orders left out of every batch do not count). */
export async function earliestCutoffOfWave(waveId: number): Promise<string | null> {
  const r = await db()("batches as b")
    .join("batch_lines as bl", "bl.batch_id", "b.id")
    .join("order_lines as ol", "ol.id", "bl.order_line_id")
    .join("orders as o", "o.id", "ol.order_id")
    .where("b.wave_id", waveId)
    .whereNotNull("o.cutoff_at")
    .min({ at: "o.cutoff_at" })
    .first();
  return r?.at ? new Date(r.at).toISOString() : null;
}

/** Picker accounts that may sign in: the first guess at how many pickers are on shift. */
export async function activePickerCount(siteId: number): Promise<number> {
  const r = await db()("users").where({ site_id: siteId, role: "picker" }).whereNull("disabled_at").count({ n: "*" });
  return Number(r[0]?.n ?? 0);
}

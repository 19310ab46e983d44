import "server-only";
import type { Knex } from "knex";
import { enqueueMail } from "./outbox";
import { appOrigin } from "@/lib/mail/config";
import { shortPickSummaryMail, waveReleasedMail } from "@/lib/mail/wave-mails";

async function plannerOf(trx: Knex.Transaction, waveId: number) {
  return trx("waves as w").join("users as u", "u.id", "w.created_by").where("w.id", waveId).first("w.name", "w.distance_mm", "w.baseline_mm", "u.email", "u.display_name");
}

/** Queued in the release's own transaction: the mail goes if and only if the release happened. */
export async function queueWaveReleasedMail(trx: Knex.Transaction, waveId: number): Promise<void> {
  const w = await plannerOf(trx, waveId);
  if (!w) return;
  const batches = await trx("batches").where({ wave_id: waveId }).orderBy("number").select("number", "line_count", "distance_mm");
  await enqueueMail(trx, {
    dedupeKey: `wave-released:${waveId}`,
    ...waveReleasedMail({
      to: w.email,
      name: w.display_name,
      waveName: w.name,
      batches: batches.map((b: { number: number; line_count: number; distance_mm: number }) => ({ number: b.number, lineCount: b.line_count, distanceMm: b.distance_mm })),
      distanceMm: Number(w.distance_mm ?? 0),
      baselineMm: Number(w.baseline_mm ?? 0),
      link: `${appOrigin()}/waves/${waveId}`,
    }),
  });
}

/** When the last batch of a wave is done: the short picks to follow up, to the wave's planner, once. */
export async function queueShortPickSummaryIfWaveDone(trx: Knex.Transaction, batchId: number): Promise<void> {
  const b = await trx("batches").where({ id: batchId }).first("wave_id");
  if (!b) return;
  const open = await trx("batches").where({ wave_id: b.wave_id }).whereNot({ status: "done" }).count({ n: "*" }).first();
  if (Number(open?.n ?? 0) > 0) return;
  const w = await plannerOf(trx, b.wave_id);
  if (!w) return;
  const shorts = await trx("batch_lines as bl")
    .join("batches as x", "x.id", "bl.batch_id")
    .join("order_lines as l", "l.id", "bl.order_line_id")
    .join("orders as o", "o.id", "l.order_id")
    .join("items as i", "i.id", "l.item_id")
    .where({ "x.wave_id": b.wave_id, "bl.pick_status": "short" })
    .orderBy([{ column: "x.number" }, { column: "bl.stop_seq" }])
    .select("x.number", "o.order_number", "bl.bin_code", "i.sku", "l.quantity", "bl.picked_qty", "bl.short_reason");
  await enqueueMail(trx, {
    dedupeKey: `short-summary:${b.wave_id}`,
    ...shortPickSummaryMail({
      to: w.email,
      name: w.display_name,
      waveName: w.name,
      shorts: shorts.map((s: { number: number; order_number: string; bin_code: string; sku: string; quantity: number; picked_qty: number | null; short_reason: string | null }) => ({
        batchNumber: s.number,
        orderNumber: s.order_number,
        binCode: s.bin_code,
        sku: s.sku,
        ordered: s.quantity,
        picked: s.picked_qty ?? 0,
        reason: s.short_reason,
      })),
      link: `${appOrigin()}/waves/${b.wave_id}`,
    }),
  });
}

import "server-only";
import type { Knex } from "knex";
import { db } from "./knex";
import { insertInChunks } from "./rows";
import { batchRowOf, batchSummaryOf } from "./batch-rows";
import type { BatchDetailDTO, BatchSummaryDTO, StoredBatch } from "@/lib/contracts/batches";
import type { UnbatchableOrder } from "@/lib/contracts/waves";

// A wave's batches: the plan the planning job stores, and the batches as the wave pages show them.

/**
 * Replaces the wave's batches with a new plan, if the wave is still at `expectedVersion` and not
 * released. Returns false when someone else changed it first.
 */
/** `beforeCommit` runs last inside the transaction (the planning job marks itself done there); throwing rolls it all back. */
export async function storePlan(
  waveId: number,
  expectedVersion: number,
  batches: StoredBatch[],
  totals: { distanceMm: number; baselineMm: number },
  unbatchable: UnbatchableOrder[],
  beforeCommit?: (trx: Knex.Transaction) => Promise<void>,
): Promise<boolean> {
  return db().transaction(async (trx) => {
    const w = await trx("waves").where({ id: waveId }).forUpdate().first("version", "status");
    if (!w || w.version !== expectedVersion || w.status === "released") return false;
    await trx("batches").where({ wave_id: waveId }).delete();
    for (const [i, b] of batches.entries()) {
      const [id] = await trx("batches").insert(batchRowOf(waveId, i + 1, b));
      const batchId = Number(id);
      if (b.stops.length)
        await insertInChunks(
          trx,
          "batch_stops",
          b.stops.map((s, seq) => ({ batch_id: batchId, seq: seq + 1, access_point: s.accessPoint, x: s.x, y: s.y })),
        );
      if (b.lines.length)
        await insertInChunks(
          trx,
          "batch_lines",
          b.lines.map((l) => ({
            order_line_id: l.orderLineId,
            batch_id: batchId,
            stop_seq: l.stopSeq,
            tote: l.tote,
            bin_code: l.binCode,
          })),
        );
    }
    await trx("waves")
      .where({ id: waveId })
      .update({
        status: "planned",
        version: expectedVersion + 1,
        distance_mm: totals.distanceMm,
        baseline_mm: totals.baselineMm,
        unbatchable: JSON.stringify(unbatchable),
        planned_at: trx.fn.now(3),
      });
    await beforeCommit?.(trx);
    return true;
  });
}

/** The wave's batches with their counts; only batch `number` when given (a handheld opening one batch). */
export async function listBatches(waveId: number, number?: number): Promise<BatchSummaryDTO[]> {
  const rows = await db()("batches as b")
    .where("b.wave_id", waveId)
    .modify((q) => (number === undefined ? q : q.where("b.number", number)))
    .select(
      "b.*",
      db().raw("(select count(*) from batch_stops s where s.batch_id = b.id) as stop_count"),
      db().raw(
        "(select count(*) from batch_lines l where l.batch_id = b.id and l.pick_status = 'picked') as picked_count",
      ),
      db().raw(
        "(select count(*) from batch_lines l where l.batch_id = b.id and l.pick_status = 'short') as short_count",
      ),
    )
    .orderBy("b.number");
  return rows.map(batchSummaryOf);
}

export async function getBatch(waveId: number, number: number): Promise<BatchDetailDTO | null> {
  // Counting every batch of a wave to show one made each pick view cost as much as the wave is big.
  const [summary] = await listBatches(waveId, number);
  if (!summary) return null;
  const [stops, lines] = await Promise.all([
    db()("batch_stops").where({ batch_id: summary.id }).orderBy("seq"),
    db()("batch_lines as bl")
      .join("order_lines as l", "l.id", "bl.order_line_id")
      .join("orders as o", "o.id", "l.order_id")
      .join("items as i", "i.id", "l.item_id")
      .where("bl.batch_id", summary.id)
      .select(
        "bl.stop_seq",
        "bl.tote",
        "bl.bin_code",
        "o.order_number",
        "i.sku",
        "i.description",
        "i.uom",
        "i.unit_weight_g",
        "l.quantity",
      )
      .orderBy([{ column: "bl.stop_seq" }, { column: "bl.tote" }]),
  ]);
  return {
    ...summary,
    stops: stops.map((s: { seq: number; x: number; y: number; access_point: number }) => ({
      seq: s.seq,
      x: s.x,
      y: s.y,
      accessPoint: s.access_point,
      lines: lines
        .filter((l: { stop_seq: number }) => l.stop_seq === s.seq)
        .map(
          (l: {
            order_number: string;
            tote: number;
            sku: string;
            description: string;
            quantity: number;
            uom: string;
            bin_code: string;
            unit_weight_g: number;
          }) => ({
            orderNumber: l.order_number,
            tote: l.tote,
            sku: l.sku,
            description: l.description,
            quantity: l.quantity,
            uom: l.uom,
            binCode: l.bin_code,
            unitWeightG: l.unit_weight_g,
          }),
        ),
    })),
  };
}

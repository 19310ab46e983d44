import "server-only";
import type { Knex } from "knex";
import { db } from "./knex";
import { chunks, isDuplicateKey } from "./rows";
import { OrdersTakenError } from "./waves";
import type { WaveFilter, WaveSettings } from "@/lib/contracts/waves";
import type { RecallableBatchDTO, WaveOrderRowDTO } from "@/lib/contracts/wave-control";

// What a planner changes on a wave before it is released, and the recall of a released batch nobody
// has started. Every change locks the wave row and checks the version the planner saw.

type Locked = { version: number; status: string; name: string; settings: unknown };

async function lockWave(trx: Knex.Transaction, siteId: number, waveId: number): Promise<Locked | undefined> {
  return trx("waves").where({ id: waveId, site_id: siteId }).forUpdate().first("version", "status", "name", "settings");
}

/** A planned wave's plan no longer fits what it holds: its batches go (print history with them) and it is a draft again. */
async function dropPlan(trx: Knex.Transaction, waveId: number): Promise<void> {
  await trx("batches").where({ wave_id: waveId }).delete();
  await trx("waves")
    .where({ id: waveId })
    .update({ status: "draft", distance_mm: null, baseline_mm: null, unbatchable: null, planned_at: null });
}

export type EditOutcome =
  { outcome: "edited"; planDropped: boolean } | { outcome: "missing" | "released" | "stale"; status?: string };

const sameSettings = (a: WaveSettings, b: WaveSettings) =>
  (Object.keys(a) as (keyof WaveSettings)[]).every((k) => a[k] === b[k]) &&
  Object.keys(a).length === Object.keys(b).length;

/**
 * A new name keeps the plan; changed settings (carts, depot, drop-off, method) throw a planned wave's
 * plan away, since its batches were cut and routed for the old ones.
 */
export async function editWave(
  siteId: number,
  waveId: number,
  expectedVersion: number,
  changes: { name?: string; settings?: WaveSettings },
): Promise<EditOutcome> {
  return db().transaction(async (trx) => {
    const w = await lockWave(trx, siteId, waveId);
    if (!w) return { outcome: "missing" as const };
    if (w.status === "released") return { outcome: "released" as const };
    if (w.version !== expectedVersion) return { outcome: "stale" as const, status: w.status };
    const old = (typeof w.settings === "string" ? JSON.parse(w.settings) : w.settings) as WaveSettings;
    const settingsChanged = !!changes.settings && !sameSettings(old, changes.settings);
    const planDropped = settingsChanged && w.status === "planned";
    if (planDropped) await dropPlan(trx, waveId);
    await trx("waves")
      .where({ id: waveId })
      .update({
        version: expectedVersion + 1,
        ...(changes.name !== undefined ? { name: changes.name.trim() } : {}),
        ...(settingsChanged ? { settings: JSON.stringify(changes.settings) } : {}),
      });
    return { outcome: "edited" as const, planDropped };
  });
}

export type OrdersOutcome =
  | { outcome: "changed"; added: number; removed: number; planDropped: boolean }
  | { outcome: "missing" | "released" | "stale" };

/**
 * Adds open orders no wave holds and takes orders out (back to open). An order to add that is no
 * longer open or is in a wave throws OrdersTakenError naming it, and nothing changes.
 */
export async function changeWaveOrders(
  siteId: number,
  waveId: number,
  expectedVersion: number,
  add: number[],
  remove: number[],
): Promise<OrdersOutcome> {
  try {
    return await db().transaction(async (trx) => {
      const w = await lockWave(trx, siteId, waveId);
      if (!w) return { outcome: "missing" as const };
      if (w.status === "released") return { outcome: "released" as const };
      if (w.version !== expectedVersion) return { outcome: "stale" as const };
      const toAdd = [...new Set(add)];
      if (toAdd.length) {
        const orders: { id: number; order_number: string; status: string }[] = [];
        for (const part of chunks(toAdd))
          orders.push(
            ...(await trx("orders")
              .where({ site_id: siteId })
              .whereIn("id", part)
              .forUpdate()
              .select("id", "order_number", "status")),
          );
        const taken = new Set<number>();
        for (const part of chunks(toAdd))
          for (const t of await trx("wave_orders").whereIn("order_id", part).pluck("order_id")) taken.add(Number(t));
        const bad = orders.filter((o) => o.status !== "open" || taken.has(o.id)).map((o) => o.order_number);
        if (orders.length !== toAdd.length) bad.push(`${toAdd.length - orders.length} that no longer exist`);
        if (bad.length) throw new OrdersTakenError(bad);
      }
      const inWave = new Set<number>();
      const toRemove = [...new Set(remove)];
      for (const part of chunks(toRemove))
        for (const id of await trx("wave_orders")
          .where({ wave_id: waveId })
          .whereIn("order_id", part)
          .pluck("order_id"))
          inWave.add(Number(id));
      const removing = toRemove.filter((id) => inWave.has(id));
      for (const part of chunks(toAdd)) {
        await trx("wave_orders").insert(part.map((order_id) => ({ order_id, wave_id: waveId })));
        await trx("orders").whereIn("id", part).update({ status: "planned", unbatched_note: null });
      }
      for (const part of chunks(removing)) {
        await trx("wave_orders").where({ wave_id: waveId }).whereIn("order_id", part).delete();
        await trx("orders").whereIn("id", part).update({ status: "open" });
      }
      const changed = toAdd.length + removing.length > 0;
      const planDropped = changed && w.status === "planned";
      if (planDropped) await dropPlan(trx, waveId);
      if (changed)
        await trx("waves")
          .where({ id: waveId })
          .update({ version: expectedVersion + 1 });
      return { outcome: "changed" as const, added: toAdd.length, removed: removing.length, planDropped };
    });
  } catch (e) {
    // Two waves adding the same order at once: the primary key on wave_orders.order_id stops the second.
    if (isDuplicateKey(e)) {
      const numbers = await db()("orders").whereIn("id", add).pluck("order_number");
      throw new OrdersTakenError(numbers);
    }
    throw e;
  }
}

/** Orders of the wave that match a filter (for "remove all matching"). */
export async function waveOrderIdsMatching(waveId: number, filter: WaveFilter): Promise<number[]> {
  const q = db()("wave_orders as wo").join("orders as o", "o.id", "wo.order_id").where("wo.wave_id", waveId);
  const cutoff = filter.cutoffBefore;
  if (cutoff && filter.includeNoCutoff) q.where((w) => w.where("o.cutoff_at", "<=", cutoff).orWhereNull("o.cutoff_at"));
  else if (cutoff) q.where("o.cutoff_at", "<=", cutoff);
  if (filter.priorities?.length) q.whereIn("o.priority", filter.priorities);
  return (await q.pluck("o.id")).map(Number);
}

function orderRows(q: Knex.QueryBuilder) {
  return q
    .select(
      "o.id",
      "o.order_number",
      "o.cutoff_at",
      "o.priority",
      db().raw("(select count(*) from order_lines l where l.order_id = o.id) as line_count"),
    )
    .orderByRaw("o.cutoff_at is null, o.cutoff_at, o.priority, o.order_number");
}

const toOrderRow = (r: Record<string, unknown>): WaveOrderRowDTO => ({
  id: Number(r.id),
  orderNumber: String(r.order_number),
  cutoffAt: r.cutoff_at ? new Date(r.cutoff_at as string).toISOString() : null,
  priority: Number(r.priority),
  lineCount: Number(r.line_count),
});

export async function ordersInWave(waveId: number): Promise<WaveOrderRowDTO[]> {
  const rows = await orderRows(
    db()("wave_orders as wo").join("orders as o", "o.id", "wo.order_id").where("wo.wave_id", waveId),
  );
  return rows.map(toOrderRow);
}

/** The rows of these orders (open ones a planner may add), in the order the ids came. */
export async function orderRowsOf(siteId: number, ids: number[]): Promise<WaveOrderRowDTO[]> {
  if (!ids.length) return [];
  const rows = await orderRows(db()("orders as o").where("o.site_id", siteId).whereIn("o.id", ids));
  return rows.map(toOrderRow);
}

/** Released batches of the wave with no line confirmed yet: the ones a planner may still recall. */
export async function recallableBatches(waveId: number): Promise<RecallableBatchDTO[]> {
  const rows = await db()("batches as b")
    .leftJoin("users as u", "u.id", "b.assigned_to")
    .where({ "b.wave_id": waveId, "b.status": "released" })
    .whereNotExists(
      db()("batch_lines as bl").whereRaw("bl.batch_id = b.id").whereNot("bl.pick_status", "open").select(db().raw("1")),
    )
    .select(
      "b.number",
      "b.version",
      "b.line_count",
      "u.display_name as held_by",
      db().raw(
        "(select count(distinct l.order_id) from batch_lines bl join order_lines l on l.id = bl.order_line_id where bl.batch_id = b.id) as order_count",
      ),
    )
    .orderBy("b.number");
  return rows.map((r: Record<string, unknown>) => ({
    number: Number(r.number),
    version: Number(r.version),
    lineCount: Number(r.line_count),
    orderCount: Number(r.order_count),
    heldBy: (r.held_by as string | null) ?? null,
  }));
}

export type RecallOutcome =
  | { outcome: "recalled"; orderNumbers: string[]; heldBy: string | null; version: number }
  | { outcome: "missing" | "not-released" | "recalled-already" | "started" | "stale"; status?: string };

/**
 * A released batch nobody has confirmed a line of comes back: its lines move to recalled_batch_lines,
 * its orders leave the wave and are open again, whoever held it loses it, and the row stays as
 * "recalled". The wave's planned walk no longer counts it.
 */
export async function recallBatch(
  siteId: number,
  waveId: number,
  number: number,
  expectedVersion: number,
  userId: string,
): Promise<RecallOutcome> {
  return db().transaction(async (trx) => {
    const w = await lockWave(trx, siteId, waveId);
    if (!w) return { outcome: "missing" as const };
    const b = await trx("batches")
      .where({ wave_id: waveId, number })
      .forUpdate()
      .first("id", "status", "version", "assigned_to", "distance_mm", "baseline_mm");
    if (!b) return { outcome: "missing" as const };
    if (b.status === "recalled") return { outcome: "recalled-already" as const };
    if (b.status === "planned" || w.status !== "released") return { outcome: "not-released" as const };
    if (b.status !== "released") return { outcome: "started" as const, status: b.status };
    const confirmed = await trx("batch_lines")
      .where({ batch_id: b.id })
      .whereNot("pick_status", "open")
      .first("order_line_id");
    if (confirmed) return { outcome: "started" as const, status: b.status };
    if (b.version !== expectedVersion) return { outcome: "stale" as const };
    const lines = await trx("batch_lines as bl")
      .join("order_lines as l", "l.id", "bl.order_line_id")
      .where("bl.batch_id", b.id)
      .select("bl.order_line_id", "bl.stop_seq", "bl.tote", "bl.bin_code", "l.order_id");
    const orderIds = [...new Set(lines.map((l: { order_id: number }) => Number(l.order_id)))];
    for (const part of chunks(lines))
      await trx("recalled_batch_lines").insert(
        part.map((l: { order_line_id: number; stop_seq: number; tote: number; bin_code: string }) => ({
          batch_id: b.id,
          order_line_id: l.order_line_id,
          stop_seq: l.stop_seq,
          tote: l.tote,
          bin_code: l.bin_code,
        })),
      );
    await trx("batch_lines").where({ batch_id: b.id }).delete();
    const orderNumbers: string[] = [];
    for (const part of chunks(orderIds)) {
      orderNumbers.push(...(await trx("orders").whereIn("id", part).orderBy("order_number").pluck("order_number")));
      await trx("wave_orders").where({ wave_id: waveId }).whereIn("order_id", part).delete();
      await trx("orders")
        .whereIn("id", part)
        .update({
          status: "open",
          unbatched_note:
            `Recalled from batch ${number} of wave “${w.name}” before anyone picked it; ready for another wave.`.slice(
              0,
              1000,
            ),
        });
    }
    await trx("batches")
      .where({ id: b.id })
      .update({
        status: "recalled",
        assigned_to: null,
        version: expectedVersion + 1,
        recalled_at: trx.fn.now(3),
        recalled_by: userId,
      });
    await trx("waves")
      .where({ id: waveId })
      .update({
        version: w.version + 1,
        distance_mm: trx.raw("greatest(coalesce(distance_mm, 0) - ?, 0)", [b.distance_mm]),
        baseline_mm: trx.raw("greatest(coalesce(baseline_mm, 0) - ?, 0)", [b.baseline_mm]),
      });
    const heldBy = b.assigned_to
      ? ((await trx("users").where({ id: b.assigned_to }).first("display_name"))?.display_name ?? null)
      : null;
    return { outcome: "recalled" as const, orderNumbers, heldBy, version: expectedVersion + 1 };
  });
}

/** The batch as it stands, to answer a repeated recall from the same planner. */
export async function batchState(
  waveId: number,
  number: number,
): Promise<{ status: string; version: number; recalledBy: string | null } | null> {
  const r = await db()("batches").where({ wave_id: waveId, number }).first("status", "version", "recalled_by");
  return r ? { status: r.status, version: Number(r.version), recalledBy: r.recalled_by } : null;
}

/** Who cancelled (discarded) a wave that is gone, from the audit line written with the deletion. */
export async function cancellationOf(
  waveId: number,
): Promise<{ actorUserId: string | null; actorName: string | null; orders: number } | null> {
  const r = await db()("audit_log as a")
    .leftJoin("users as u", "u.id", "a.actor_user_id")
    .where({ "a.event": "wave.discarded", "a.subject": `wave:${waveId}` })
    .orderBy("a.id", "desc")
    .first("a.actor_user_id", "u.display_name", "a.detail");
  if (!r) return null;
  const detail = (typeof r.detail === "string" ? JSON.parse(r.detail) : r.detail) as { orders?: number } | null;
  return { actorUserId: r.actor_user_id, actorName: r.display_name ?? null, orders: Number(detail?.orders ?? 0) };
}

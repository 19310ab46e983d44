import "server-only";
import type { Knex } from "knex";
import { db } from "./knex";
import { iso } from "./rows";
import { audit } from "./audit";
import type { ShortPickDTO } from "@/lib/contracts/waves";
import type { FollowUpAction, ReplenishmentDTO, ShortPickRowDTO } from "@/lib/contracts/short-picks";

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

// ——— The shift's follow-up list ———

const shortPickColumns = [
  "bl.order_line_id",
  "bl.bin_code",
  "bl.picked_qty",
  "bl.short_reason",
  "bl.confirmed_at",
  "bl.follow_up",
  "bl.follow_up_at",
  "bl.replenish_at",
  "bl.follow_up_version",
  "bl.repick_order_id",
  "b.number as batch_number",
  "b.wave_id",
  "w.name as wave_name",
  "o.id as order_id",
  "o.order_number",
  "l.quantity",
  "i.sku",
  "pu.display_name as picker_name",
  "fu.display_name as follow_up_name",
  "ro.order_number as repick_number",
];

function shortPicksQuery(q: Knex | Knex.Transaction, siteId: number) {
  return q("batch_lines as bl")
    .join("batches as b", "b.id", "bl.batch_id")
    .join("waves as w", "w.id", "b.wave_id")
    .join("order_lines as l", "l.id", "bl.order_line_id")
    .join("orders as o", "o.id", "l.order_id")
    .join("items as i", "i.id", "l.item_id")
    .leftJoin("users as pu", "pu.id", "bl.confirmed_by")
    .leftJoin("users as fu", "fu.id", "bl.follow_up_by")
    .leftJoin("orders as ro", "ro.id", "bl.repick_order_id")
    .where({ "w.site_id": siteId, "bl.pick_status": "short" })
    .select(shortPickColumns);
}

type ShortPickRow = {
  order_line_id: number;
  bin_code: string;
  picked_qty: number | null;
  short_reason: string | null;
  confirmed_at: Date | null;
  follow_up: "repick" | "cancel" | null;
  follow_up_at: Date | null;
  replenish_at: Date | null;
  follow_up_version: number;
  repick_order_id: number | null;
  batch_number: number;
  wave_id: number;
  wave_name: string;
  order_id: number;
  order_number: string;
  quantity: number;
  sku: string;
  picker_name: string | null;
  follow_up_name: string | null;
  repick_number: string | null;
};

const toShortPick = (r: ShortPickRow): ShortPickRowDTO => ({
  lineId: Number(r.order_line_id),
  orderId: Number(r.order_id),
  orderNumber: r.order_number,
  waveId: Number(r.wave_id),
  waveName: r.wave_name,
  batchNumber: Number(r.batch_number),
  sku: r.sku,
  binCode: r.bin_code,
  ordered: Number(r.quantity),
  picked: Number(r.picked_qty ?? 0),
  short: Number(r.quantity) - Number(r.picked_qty ?? 0),
  reason: r.short_reason,
  pickerName: r.picker_name,
  at: iso(r.confirmed_at),
  followUp: r.follow_up,
  followUpByName: r.follow_up_name,
  followUpAt: iso(r.follow_up_at),
  repickOrder:
    r.repick_order_id === null || r.repick_number === null
      ? null
      : { id: Number(r.repick_order_id), orderNumber: r.repick_number },
  replenishAt: iso(r.replenish_at),
  version: Number(r.follow_up_version),
});

/** Short picks confirmed in [start, end), optionally of one wave, in the order they were reported. */
export async function shortPicksOfShift(
  siteId: number,
  range: { start: Date; end: Date },
  waveId?: number,
): Promise<{ shortPicks: ShortPickRowDTO[]; waves: { id: number; name: string }[] }> {
  const inRange = (q: Knex.QueryBuilder) =>
    q.where("bl.confirmed_at", ">=", range.start).andWhere("bl.confirmed_at", "<", range.end);
  const q = inRange(shortPicksQuery(db(), siteId));
  if (waveId !== undefined) q.andWhere("b.wave_id", waveId);
  const rows = (await q.orderBy([{ column: "bl.confirmed_at" }, { column: "bl.order_line_id" }])) as ShortPickRow[];
  const waves = (await inRange(
    db()("batch_lines as bl")
      .join("batches as b", "b.id", "bl.batch_id")
      .join("waves as w", "w.id", "b.wave_id")
      .where({ "w.site_id": siteId, "bl.pick_status": "short" }),
  )
    .distinct("w.id", "w.name")
    .orderBy("w.id")) as { id: number; name: string }[];
  return { shortPicks: rows.map(toShortPick), waves: waves.map((w) => ({ id: Number(w.id), name: w.name })) };
}

export async function shortPickRow(
  siteId: number,
  lineId: number,
  q: Knex | Knex.Transaction = db(),
): Promise<ShortPickRowDTO | null> {
  const r = (await shortPicksQuery(q, siteId).where("bl.order_line_id", lineId).first()) as ShortPickRow | undefined;
  return r ? toShortPick(r) : null;
}

/** Bins whose replenishment flag is up, oldest first. */
export async function openReplenishments(siteId: number): Promise<ReplenishmentDTO[]> {
  const rows = (await db()("bin_replenishments as r")
    .leftJoin("items as i", "i.id", "r.item_id")
    .leftJoin("users as u", "u.id", "r.requested_by")
    .where("r.site_id", siteId)
    .whereNotNull("r.open_bin")
    .orderBy([{ column: "r.requested_at" }, { column: "r.id" }])
    .select("r.id", "r.bin_code", "i.sku", "u.display_name", "r.requested_at", "r.version")) as {
    id: number;
    bin_code: string;
    sku: string | null;
    display_name: string | null;
    requested_at: Date;
    version: number;
  }[];
  return rows.map((r) => ({
    id: Number(r.id),
    binCode: r.bin_code,
    sku: r.sku,
    requestedByName: r.display_name,
    requestedAt: r.requested_at.toISOString(),
    version: Number(r.version),
  }));
}

export type FollowUpOutcome =
  { kind: "done" | "replay"; row: ShortPickRowDTO } | { kind: "missing" } | { kind: "refused"; message: string };

const ACTION_DONE: Record<FollowUpAction, string> = {
  repick: "chose to re-pick it later",
  cancel: "cancelled the rest of the line",
  replenish: "flagged the bin for replenishment",
};

/**
 * One follow-up on one short pick, in one transaction under the batch line's row lock. The same
 * person sending the same follow-up again (a resend) gets the row as it stands, once; anyone else,
 * or a screen loaded before the line last changed, is refused with who did what.
 */
export async function followUpShortPick(
  siteId: number,
  lineId: number,
  action: FollowUpAction,
  version: number,
  userId: string,
  ip: string | null,
): Promise<FollowUpOutcome> {
  return db().transaction(async (trx) => {
    const line = await trx("batch_lines").where({ order_line_id: lineId }).forUpdate().first();
    const row = line ? await shortPickRow(siteId, lineId, trx) : null;
    if (!line || !row) {
      const anyLine = line
        ? await trx("batch_lines as bl")
            .join("batches as b", "b.id", "bl.batch_id")
            .join("waves as w", "w.id", "b.wave_id")
            .where({ "bl.order_line_id": lineId, "w.site_id": siteId })
            .first("bl.pick_status")
        : null;
      if (anyLine)
        return {
          kind: "refused" as const,
          message: `This line was not picked short (it is ${anyLine.pick_status}), so it needs no follow-up.`,
        };
      return { kind: "missing" as const };
    }
    const who = async (id: string | null) =>
      id ? ((await trx("users").where({ id }).first("display_name"))?.display_name ?? "someone") : "someone";
    if (action === "replenish") {
      if (line.replenish_at !== null) {
        if (line.replenish_by === userId) return { kind: "replay" as const, row };
        return {
          kind: "refused" as const,
          message: `${await who(line.replenish_by)} already flagged bin ${row.binCode} for replenishment. Reload the list.`,
        };
      }
    } else if (line.follow_up !== null) {
      if (line.follow_up === action && line.follow_up_by === userId) return { kind: "replay" as const, row };
      return {
        kind: "refused" as const,
        message:
          `${await who(line.follow_up_by)} already ${ACTION_DONE[line.follow_up as FollowUpAction]} ` +
          `for order ${row.orderNumber} (${row.sku}). Reload the list to see it; a line gets one outcome.`,
      };
    }
    if (Number(line.follow_up_version) !== version) {
      const changes = [
        line.follow_up ? `${await who(line.follow_up_by)} ${ACTION_DONE[line.follow_up as FollowUpAction]}` : null,
        line.replenish_at ? `${await who(line.replenish_by)} ${ACTION_DONE.replenish}` : null,
      ].filter(Boolean);
      return {
        kind: "refused" as const,
        message:
          `This short pick changed since you loaded the list${changes.length ? ` (${changes.join("; ")})` : ""}. ` +
          "Reload the list and choose again.",
      };
    }
    const change: Record<string, unknown> = { follow_up_version: version + 1 };
    if (action === "replenish") {
      Object.assign(change, { replenish_by: userId, replenish_at: trx.fn.now(3) });
      const item = await trx("order_lines").where({ id: lineId }).first("item_id");
      const open = await trx("bin_replenishments")
        .where({ site_id: siteId, open_bin: row.binCode })
        .forUpdate()
        .first("id");
      if (!open)
        await trx("bin_replenishments").insert({
          site_id: siteId,
          bin_code: row.binCode,
          open_bin: row.binCode,
          item_id: item?.item_id ?? null,
          order_line_id: lineId,
          requested_by: userId,
        });
    } else {
      Object.assign(change, { follow_up: action, follow_up_by: userId, follow_up_at: trx.fn.now(3) });
      if (action === "repick") change.repick_order_id = await addToRepickOrder(trx, siteId, lineId, row.short);
    }
    await trx("batch_lines").where({ order_line_id: lineId }).update(change);
    await audit(
      {
        event: "shortpick.followed_up",
        actorUserId: userId,
        subject: `order_line:${lineId}`,
        ip,
        detail: { action, orderNumber: row.orderNumber, binCode: row.binCode },
      },
      trx,
    );
    return { kind: "done" as const, row: (await shortPickRow(siteId, lineId, trx))! };
  });
}

/**
 * The remaining quantity of a short line goes on an open re-pick order of the original: the latest
 * one if no wave has taken it yet, else a new one numbered "<original>-R<n>". The original's row lock
 * makes two re-picks of one order at once number their orders one after the other.
 */
async function addToRepickOrder(
  trx: Knex.Transaction,
  siteId: number,
  lineId: number,
  quantity: number,
): Promise<number> {
  const line = await trx("order_lines as l")
    .join("orders as o", "o.id", "l.order_id")
    .where("l.id", lineId)
    .first("l.item_id", "o.id as order_id", "o.parent_order_id", "o.cutoff_at", "o.priority", "o.customer_ref");
  const rootId = Number(line.parent_order_id ?? line.order_id);
  const root = await trx("orders").where({ id: rootId }).forUpdate().first("id", "order_number");
  const reusable = await trx("orders as o")
    .leftJoin("wave_orders as wo", "wo.order_id", "o.id")
    .where({ "o.parent_order_id": rootId, "o.status": "open" })
    .whereNull("wo.order_id")
    .orderBy("o.id", "desc")
    .first("o.id");
  let orderId: number;
  if (reusable) orderId = Number(reusable.id);
  else {
    const count = await trx("orders").where({ parent_order_id: rootId }).count({ n: "*" }).first();
    let n = Number(count?.n ?? 0) + 1;
    // An imported order may already carry the number; count on past it.
    while (
      await trx("orders")
        .where({ site_id: siteId, order_number: `${root.order_number}-R${n}` })
        .first("id")
    )
      n++;
    const [id] = await trx("orders").insert({
      site_id: siteId,
      order_number: `${root.order_number}-R${n}`,
      customer_ref: line.customer_ref,
      priority: line.priority,
      cutoff_at: line.cutoff_at,
      status: "open",
      parent_order_id: rootId,
    });
    orderId = Number(id);
  }
  const last = await trx("order_lines").where({ order_id: orderId }).max({ n: "line_no" }).first();
  await trx("order_lines").insert({
    order_id: orderId,
    line_no: Number(last?.n ?? 0) + 1,
    item_id: line.item_id,
    quantity,
    repick_of_line_id: lineId,
  });
  return orderId;
}

export type ClearOutcome = { kind: "done" | "replay" } | { kind: "missing" } | { kind: "refused"; message: string };

/** Lowers a bin's replenishment flag once the bin is filled again. */
export async function clearReplenishment(
  siteId: number,
  id: number,
  version: number,
  userId: string,
  ip: string | null,
): Promise<ClearOutcome> {
  return db().transaction(async (trx) => {
    const r = await trx("bin_replenishments").where({ id, site_id: siteId }).forUpdate().first();
    if (!r) return { kind: "missing" as const };
    if (r.cleared_at !== null) {
      if (r.cleared_by === userId) return { kind: "replay" as const };
      const u = r.cleared_by ? await trx("users").where({ id: r.cleared_by }).first("display_name") : null;
      return {
        kind: "refused" as const,
        message: `${u?.display_name ?? "Someone"} already cleared the flag on bin ${r.bin_code}. Reload the list.`,
      };
    }
    if (Number(r.version) !== version)
      return {
        kind: "refused" as const,
        message: `The flag on bin ${r.bin_code} changed since you loaded the list. Reload it and try again.`,
      };
    await trx("bin_replenishments")
      .where({ id })
      .update({ cleared_at: trx.fn.now(3), cleared_by: userId, open_bin: null, version: version + 1 });
    await audit(
      { event: "replenishment.cleared", actorUserId: userId, subject: `bin:${r.bin_code}`, ip, detail: { id } },
      trx,
    );
    return { kind: "done" as const };
  });
}

import "server-only";
import type { Knex } from "knex";
import { db } from "./knex";
import type { OrderRecord } from "@/lib/imports/orders";
import { chunks, isDuplicateKey, iso } from "./rows";
import type { OrderDetailDTO, OrderDTO, OrderLineDTO, OrderStatus } from "@/lib/contracts/orders";
import { isOverdue, NO_FAMILY, pickState, type FamilyCounts, type LineCounts } from "@/lib/orders/pick-state";

const CHUNK = 500;

type OrderRow = {
  id: number;
  order_number: string;
  customer_ref: string | null;
  priority: number;
  cutoff_at: Date | null;
  status: OrderStatus;
  unbatched_note: string | null;
  line_count: number | string;
  parent_order_id: number | null;
  parent_number: string | null;
};

function ordersQuery(siteId: number) {
  return db()("orders as o")
    .leftJoin("order_lines as l", "l.order_id", "o.id")
    .leftJoin("orders as po", "po.id", "o.parent_order_id")
    .where("o.site_id", siteId)
    .groupBy("o.id")
    .select(
      "o.id",
      "o.order_number",
      "o.customer_ref",
      "o.priority",
      "o.cutoff_at",
      "o.status",
      "o.unbatched_note",
      "o.parent_order_id",
      "po.order_number as parent_number",
      db().raw("count(l.id) as line_count"),
    );
}

/**
 * Each order's lines by pick state and follow-up, and the same for the re-pick orders of each
 * original: what pickState() in lib/orders/pick-state.ts works from.
 */
async function pickCounts(
  siteId: number,
  orderIds?: readonly number[],
): Promise<{ own: Map<number, LineCounts>; family: Map<number, FamilyCounts> }> {
  const counts = (col: string) =>
    [
      db().raw(`sum(case when ${col} = 'open' then 1 else 0 end) as open_n`),
      db().raw(`sum(case when ${col} = 'picked' then 1 else 0 end) as picked_n`),
      db().raw(`sum(case when ${col} = 'short' and bl.follow_up is null then 1 else 0 end) as short_open`),
      db().raw(`sum(case when ${col} = 'short' and bl.follow_up = 'repick' then 1 else 0 end) as short_repick`),
      db().raw(`sum(case when ${col} = 'short' and bl.follow_up = 'cancel' then 1 else 0 end) as short_cancel`),
    ] as const;
  const ownQ = db()("orders as o")
    .join("order_lines as l", "l.order_id", "o.id")
    .join("batch_lines as bl", "bl.order_line_id", "l.id")
    .where("o.site_id", siteId)
    .groupBy("o.id")
    .select("o.id", ...counts("bl.pick_status"));
  const familyQ = db()("orders as o")
    .join("order_lines as l", "l.order_id", "o.id")
    .leftJoin("batch_lines as bl", "bl.order_line_id", "l.id")
    .where("o.site_id", siteId)
    .whereNotNull("o.parent_order_id")
    .groupBy("o.parent_order_id")
    .select(
      "o.parent_order_id",
      db().raw(
        "sum(case when bl.order_line_id is null or bl.pick_status = 'open' or (bl.pick_status = 'short' and bl.follow_up is null) then 1 else 0 end) as unsettled",
      ),
      db().raw("sum(case when bl.follow_up = 'cancel' then 1 else 0 end) as cancelled"),
    );
  if (orderIds) {
    const ids = orderIds.length ? [...orderIds] : [-1];
    ownQ.whereIn("o.id", ids);
    familyQ.where((w) =>
      w
        .whereIn("o.parent_order_id", ids)
        .orWhereIn(
          "o.parent_order_id",
          db()("orders").whereIn("id", ids).whereNotNull("parent_order_id").select("parent_order_id"),
        ),
    );
  }
  const [own, family] = await Promise.all([ownQ, familyQ]);
  return {
    own: new Map(
      (own as Record<string, unknown>[]).map((r) => [
        Number(r.id),
        {
          open: Number(r.open_n ?? 0),
          picked: Number(r.picked_n ?? 0),
          shortOpen: Number(r.short_open ?? 0),
          shortRepick: Number(r.short_repick ?? 0),
          shortCancel: Number(r.short_cancel ?? 0),
        },
      ]),
    ),
    family: new Map(
      (family as Record<string, unknown>[]).map((r) => [
        Number(r.parent_order_id),
        { unsettled: Number(r.unsettled ?? 0), cancelled: Number(r.cancelled ?? 0) },
      ]),
    ),
  };
}

const NO_LINES: LineCounts = { open: 0, picked: 0, shortOpen: 0, shortRepick: 0, shortCancel: 0 };

function toOrder(
  r: OrderRow,
  counts: { own: Map<number, LineCounts>; family: Map<number, FamilyCounts> },
  now: Date,
): OrderDTO {
  const cutoffAt = iso(r.cutoff_at);
  const state = pickState(
    r.status,
    counts.own.get(r.id) ?? NO_LINES,
    counts.family.get(Number(r.parent_order_id ?? r.id)) ?? NO_FAMILY,
  );
  return {
    id: r.id,
    orderNumber: r.order_number,
    customerRef: r.customer_ref,
    priority: r.priority,
    cutoffAt,
    status: r.status,
    lineCount: Number(r.line_count),
    note: r.unbatched_note,
    pickState: state,
    overdue: isOverdue(cutoffAt, state, now),
    parent:
      r.parent_order_id === null || r.parent_number === null
        ? null
        : { id: Number(r.parent_order_id), orderNumber: r.parent_number },
  };
}

export async function listOrders(siteId: number, status?: OrderStatus): Promise<OrderDTO[]> {
  const q = ordersQuery(siteId).orderByRaw("o.cutoff_at is null, o.cutoff_at, o.priority, o.order_number");
  if (status) q.andWhere("o.status", status);
  const [rows, counts] = await Promise.all([q as Promise<OrderRow[]>, pickCounts(siteId)]);
  const now = new Date();
  return rows.map((r) => toOrder(r, counts, now));
}

/** One order with its lines, each line's bin, batch and wave, pick state and follow-up; null if not at this site. */
export async function getOrderDetail(siteId: number, id: number): Promise<OrderDetailDTO | null> {
  const r = (await ordersQuery(siteId).where("o.id", id).first()) as OrderRow | undefined;
  if (!r) return null;
  const children = (await db()("orders")
    .where({ site_id: siteId, parent_order_id: Number(r.parent_order_id ?? r.id) })
    .orderBy("id")
    .select("id")) as { id: number }[];
  const childIds = children.map((c) => Number(c.id)).filter((c) => c !== r.id);
  const counts = await pickCounts(siteId, [r.id, ...childIds]);
  const now = new Date();
  const order = toOrder(r, counts, now);
  const wave = await db()("wave_orders as wo")
    .join("waves as w", "w.id", "wo.wave_id")
    .where("wo.order_id", r.id)
    .first("w.id", "w.name");
  const lines = (await db()("order_lines as l")
    .join("items as i", "i.id", "l.item_id")
    .leftJoin("batch_lines as bl", "bl.order_line_id", "l.id")
    .leftJoin("batches as b", "b.id", "bl.batch_id")
    .leftJoin("waves as w", "w.id", "b.wave_id")
    .leftJoin("orders as ro", "ro.id", "bl.repick_order_id")
    .leftJoin("order_lines as pl", "pl.id", "l.repick_of_line_id")
    .leftJoin("orders as po", "po.id", "pl.order_id")
    .where("l.order_id", r.id)
    .orderBy("l.line_no")
    .select(
      "l.id",
      "l.line_no",
      "l.quantity",
      "i.sku",
      "i.description",
      "bl.bin_code",
      "bl.pick_status",
      "bl.picked_qty",
      "bl.short_reason",
      "bl.follow_up",
      "bl.replenish_at",
      "b.id as batch_id",
      "b.number as batch_number",
      "w.id as wave_id",
      "w.name as wave_name",
      "ro.id as repick_id",
      "ro.order_number as repick_number",
      "pl.line_no as parent_line_no",
      "po.id as parent_order_id",
      "po.order_number as parent_order_number",
      db().raw(
        "(select ib.bin_code from item_bins ib where ib.item_id = l.item_id order by ib.`rank`, ib.bin_code limit 1) as first_bin",
      ),
    )) as Record<string, unknown>[];
  const repickOrders = childIds.length
    ? ((await ordersQuery(siteId).whereIn("o.id", childIds).orderBy("o.id")) as OrderRow[]).map((c) => {
        const dto = toOrder(c, counts, now);
        return { id: dto.id, orderNumber: dto.orderNumber, status: dto.status, pickState: dto.pickState };
      })
    : [];
  const num = (v: unknown) => (v === null || v === undefined ? null : Number(v));
  return {
    ...order,
    wave: wave ? { id: Number(wave.id), name: wave.name } : null,
    repickOrders,
    lines: lines.map((l) => ({
      id: Number(l.id),
      lineNo: Number(l.line_no),
      sku: String(l.sku),
      description: String(l.description),
      quantity: Number(l.quantity),
      binCode: (l.bin_code as string | null) ?? (l.first_bin as string | null) ?? null,
      batch:
        l.batch_id === null
          ? null
          : {
              id: Number(l.batch_id),
              number: Number(l.batch_number),
              waveId: Number(l.wave_id),
              waveName: String(l.wave_name),
            },
      pickStatus: (l.pick_status as OrderLineDTO["pickStatus"]) ?? null,
      pickedQty: num(l.picked_qty),
      shortReason: (l.short_reason as string | null) ?? null,
      followUp: (l.follow_up as OrderLineDTO["followUp"]) ?? null,
      repickOrder: l.repick_id === null ? null : { id: Number(l.repick_id), orderNumber: String(l.repick_number) },
      replenishFlagged: l.replenish_at !== null,
      repickOf:
        l.parent_order_id === null
          ? null
          : {
              orderId: Number(l.parent_order_id),
              orderNumber: String(l.parent_order_number),
              lineNo: Number(l.parent_line_no),
            },
    })),
  };
}

/** Which of these order numbers exist at the site (upper-cased: the unique key ignores case). */
export async function existingOrderNumbers(siteId: number, numbers: readonly string[]): Promise<Set<string>> {
  const out = new Set<string>();
  for (const part of chunks(numbers, CHUNK)) {
    const rows = await db()("orders").where({ site_id: siteId }).whereIn("order_number", part).select("order_number");
    for (const r of rows as { order_number: string }[]) out.add(r.order_number.toUpperCase());
  }
  return out;
}

export class OrderNumberTakenError extends Error {}

/** New orders and their lines from one import file, inside the caller's transaction. */
export async function insertOrders(
  trx: Knex.Transaction,
  siteId: number,
  importFileId: number,
  orders: readonly OrderRecord[],
): Promise<{ orders: number; lines: number }> {
  let lines = 0;
  for (const part of chunks(orders, CHUNK)) {
    try {
      await trx("orders").insert(
        part.map((o) => ({
          site_id: siteId,
          order_number: o.orderNumber,
          customer_ref: o.customerRef,
          priority: o.priority,
          cutoff_at: o.cutoffAt,
          import_file_id: importFileId,
        })),
      );
    } catch (e) {
      // Another file with one of these numbers committed after this one was checked.
      if (isDuplicateKey(e)) throw new OrderNumberTakenError(String((e as Error).message));
      throw e;
    }
    const ids = await trx("orders")
      .where({ site_id: siteId, import_file_id: importFileId })
      .whereIn(
        "order_number",
        part.map((o) => o.orderNumber),
      )
      .select("id", "order_number");
    const idOf = new Map(
      (ids as { id: number; order_number: string }[]).map((r) => [r.order_number.toUpperCase(), r.id]),
    );
    const rows = part.flatMap((o) =>
      o.lines.map((l) => ({
        order_id: idOf.get(o.orderNumber.toUpperCase())!,
        line_no: l.lineNo,
        item_id: l.itemId,
        quantity: l.quantity,
      })),
    );
    for (const slice of chunks(rows, CHUNK)) await trx("order_lines").insert(slice);
    lines += rows.length;
  }
  return { orders: orders.length, lines };
}

/** What one import file put in: for answering a repeated submit of the same file. */
export async function countsOfImport(importFileId: number): Promise<{ orders: number; lines: number }> {
  const r = await db()("orders as o")
    .leftJoin("order_lines as l", "l.order_id", "o.id")
    .where("o.import_file_id", importFileId)
    .first(db().raw("count(distinct o.id) as order_count"), db().raw("count(l.id) as line_count"));
  return { orders: Number(r?.order_count ?? 0), lines: Number(r?.line_count ?? 0) };
}

export type PlanningLine = {
  lineId: number;
  lineNo: number;
  sku: string;
  quantity: number;
  unitWeightG: number;
  binCodes: string[];
};
export type PlanningOrder = {
  orderId: number;
  orderNumber: string;
  cutoffAt: string | null;
  priority: number;
  customerRef: string | null;
  lines: PlanningLine[];
};

/**
 * Open orders (not yet in a planned or released wave) with their lines, for wave planning, most
 * urgent first. binCodes are the item's pick bins by rank; with layoutVersionId only those that
 * exist in that layout version.
 */
export async function openOrdersForPlanning(
  siteId: number,
  opts: { cutoffBefore?: Date; priorities?: number[]; layoutVersionId?: number } = {},
): Promise<PlanningOrder[]> {
  const q = db()("orders").where({ site_id: siteId, status: "open" });
  if (opts.cutoffBefore) q.andWhere("cutoff_at", "<", opts.cutoffBefore);
  if (opts.priorities) q.whereIn("priority", opts.priorities.length ? opts.priorities : [-1]);
  const orders = (await q
    .orderByRaw("cutoff_at is null, cutoff_at, priority, order_number")
    .select("id", "order_number", "cutoff_at", "priority", "customer_ref")) as {
    id: number;
    order_number: string;
    cutoff_at: Date | null;
    priority: number;
    customer_ref: string | null;
  }[];
  const byOrder = new Map<number, PlanningLine[]>();
  for (const part of chunks(orders, CHUNK)) {
    const ids = part.map((o) => o.id);
    const lines = (await db()("order_lines as l")
      .join("items as it", "it.id", "l.item_id")
      .whereIn("l.order_id", ids)
      .orderBy(["l.order_id", "l.line_no"])
      .select("l.id", "l.order_id", "l.line_no", "l.quantity", "l.item_id", "it.sku", "it.unit_weight_g")) as {
      id: number;
      order_id: number;
      line_no: number;
      quantity: number;
      item_id: number;
      sku: string;
      unit_weight_g: number;
    }[];
    const itemIds = [...new Set(lines.map((l) => l.item_id))];
    const binsQ = db()("item_bins as b").whereIn("b.item_id", itemIds.length ? itemIds : [-1]);
    const versionId = opts.layoutVersionId;
    if (versionId !== undefined)
      binsQ.whereExists((w) =>
        w
          .select(db().raw("1"))
          .from("layout_bins as lb")
          .whereRaw("lb.code = b.bin_code")
          .andWhere("lb.layout_version_id", versionId),
      );
    binsQ.orderBy(["b.item_id", "b.rank"]).select("b.item_id", "b.bin_code");
    const binsOf = new Map<number, string[]>();
    for (const b of (await binsQ) as { item_id: number; bin_code: string }[])
      binsOf.set(b.item_id, [...(binsOf.get(b.item_id) ?? []), b.bin_code]);
    for (const l of lines) {
      const list = byOrder.get(l.order_id) ?? [];
      list.push({
        lineId: l.id,
        lineNo: l.line_no,
        sku: l.sku,
        quantity: l.quantity,
        unitWeightG: l.unit_weight_g,
        binCodes: binsOf.get(l.item_id) ?? [],
      });
      byOrder.set(l.order_id, list);
    }
  }
  return orders.map((o) => ({
    orderId: o.id,
    orderNumber: o.order_number,
    cutoffAt: iso(o.cutoff_at),
    priority: o.priority,
    customerRef: o.customer_ref,
    lines: byOrder.get(o.id) ?? [],
  }));
}

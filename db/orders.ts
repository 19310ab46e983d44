import "server-only";
import type { Knex } from "knex";
import { db } from "./knex";
import type { OrderRecord } from "@/lib/imports/orders";
import { chunks, isDuplicateKey, iso } from "./rows";
import type { OrderDTO, OrderStatus } from "@/lib/contracts/orders";

const CHUNK = 500;

export async function listOrders(siteId: number, status?: OrderStatus): Promise<OrderDTO[]> {
  const q = db()("orders as o")
    .leftJoin("order_lines as l", "l.order_id", "o.id")
    .where("o.site_id", siteId)
    .groupBy("o.id")
    .orderByRaw("o.cutoff_at is null, o.cutoff_at, o.priority, o.order_number")
    .select(
      "o.id",
      "o.order_number",
      "o.customer_ref",
      "o.priority",
      "o.cutoff_at",
      "o.status",
      "o.unbatched_note",
      db().raw("count(l.id) as line_count"),
    );
  if (status) q.andWhere("o.status", status);
  const rows = (await q) as {
    id: number;
    order_number: string;
    customer_ref: string | null;
    priority: number;
    cutoff_at: Date | null;
    status: OrderStatus;
    unbatched_note: string | null;
    line_count: number | string;
  }[];
  return rows.map((r) => ({
    id: r.id,
    orderNumber: r.order_number,
    customerRef: r.customer_ref,
    priority: r.priority,
    cutoffAt: iso(r.cutoff_at),
    status: r.status,
    lineCount: Number(r.line_count),
    note: r.unbatched_note,
  }));
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

import "server-only";
import type { Knex } from "knex";
import { db } from "./knex";
import { queueWaveReleasedMail } from "./wave-mail";
import type { WaveOrder } from "@/lib/batching/types";
import type {
  UnbatchableOrder,
  WaveDTO,
  WaveFilter,
  WavePreviewDTO,
  WaveSettings,
  WaveStatus,
} from "@/lib/contracts/waves";
import { chunks, iso, json } from "./rows";

function wavesOfSite(siteId: number) {
  return db()("waves as w")
    .join("layout_versions as v", "v.id", "w.layout_version_id")
    .join("floor_plans as p", "p.id", "v.floor_plan_id")
    .where("w.site_id", siteId)
    .select(
      "w.*",
      "v.number as layout_number",
      "p.id as floor_plan_id",
      "p.name as floor_plan_name",
      db().raw("(select count(*) from wave_orders o where o.wave_id = w.id) as order_count"),
      db().raw("(select count(*) from batches b where b.wave_id = w.id) as batch_count"),
    );
}

type WaveRow = {
  id: number;
  name: string;
  status: WaveStatus;
  version: number;
  layout_version_id: number;
  layout_number: number;
  floor_plan_id: number;
  floor_plan_name: string;
  settings: unknown;
  order_count: number | string;
  batch_count: number | string;
  distance_mm: number | string | null;
  baseline_mm: number | string | null;
  unbatchable: unknown;
  created_at: Date;
  planned_at: Date | null;
  released_at: Date | null;
  released_by: string | null;
};

function toDTO(r: WaveRow): WaveDTO {
  return {
    id: r.id,
    name: r.name,
    status: r.status,
    version: r.version,
    layoutVersionId: r.layout_version_id,
    layoutVersionNumber: r.layout_number,
    floorPlanId: r.floor_plan_id,
    floorPlanName: r.floor_plan_name,
    settings: json<WaveSettings>(r.settings),
    orderCount: Number(r.order_count),
    batchCount: Number(r.batch_count),
    distanceMm: r.distance_mm === null ? null : Number(r.distance_mm),
    baselineMm: r.baseline_mm === null ? null : Number(r.baseline_mm),
    unbatchable: r.unbatchable ? json(r.unbatchable) : [],
    createdAt: r.created_at.toISOString(),
    plannedAt: iso(r.planned_at),
    releasedAt: iso(r.released_at),
    releasedBy: r.released_by,
  };
}

export async function listWaves(siteId: number): Promise<WaveDTO[]> {
  const rows = await wavesOfSite(siteId).orderBy("w.created_at", "desc");
  return rows.map(toDTO);
}

export async function getWave(siteId: number, id: number): Promise<WaveDTO | null> {
  const r = await wavesOfSite(siteId).where("w.id", id).first();
  return r ? toDTO(r) : null;
}

export class OrdersTakenError extends Error {
  constructor(readonly orderNumbers: string[]) {
    super(`orders already in a wave: ${orderNumbers.join(", ")}`);
  }
}

/** A draft wave claiming open orders; an order already in another wave makes the whole call fail. */
export async function createWave(
  siteId: number,
  input: { name: string; layoutVersionId: number; settings: WaveSettings; orderIds: number[] },
  userId: string,
): Promise<number> {
  return db().transaction(async (trx) => {
    const orders = await trx("orders")
      .where({ site_id: siteId })
      .whereIn("id", input.orderIds)
      .forUpdate()
      .select("id", "order_number", "status");
    const taken = await trx("wave_orders").whereIn("order_id", input.orderIds).select("order_id");
    const takenIds = new Set(taken.map((t: { order_id: number }) => t.order_id));
    const bad = orders
      .filter((o: { id: number; status: string }) => o.status !== "open" || takenIds.has(o.id))
      .map((o: { order_number: string }) => o.order_number);
    if (bad.length) throw new OrdersTakenError(bad);
    if (orders.length !== new Set(input.orderIds).size) throw new OrdersTakenError(["(some orders no longer exist)"]);
    const [id] = await trx("waves").insert({
      site_id: siteId,
      name: input.name.trim(),
      layout_version_id: input.layoutVersionId,
      settings: JSON.stringify(input.settings),
      created_by: userId,
    });
    const waveId = Number(id);
    for (const chunk of chunks(input.orderIds)) {
      await trx("wave_orders").insert(chunk.map((order_id) => ({ order_id, wave_id: waveId })));
      // "planned" = in a wave; the order lists show it apart from the open ones still to plan.
      await trx("orders").whereIn("id", chunk).update({ status: "planned", unbatched_note: null });
    }
    return waveId;
  });
}

/** The wave's orders with each line's first pick bin that exists in the wave's layout version. */
export async function ordersOfWave(waveId: number): Promise<WaveOrder[]> {
  const rows = await db()("wave_orders as wo")
    .join("waves as w", "w.id", "wo.wave_id")
    .join("orders as o", "o.id", "wo.order_id")
    .join("order_lines as l", "l.order_id", "o.id")
    .join("items as i", "i.id", "l.item_id")
    .where("wo.wave_id", waveId)
    .select(
      "o.id as order_id",
      "o.order_number",
      "o.cutoff_at",
      "o.priority",
      "l.id as line_id",
      "l.quantity",
      "i.sku",
      "i.unit_weight_g",
      db().raw(
        "(select ib.bin_code from item_bins ib join layout_bins lb on lb.code = ib.bin_code and lb.layout_version_id = w.layout_version_id where ib.item_id = i.id order by ib.`rank`, ib.bin_code limit 1) as bin_code",
      ),
      db().raw(
        "(select group_concat(ib.bin_code order by ib.`rank`, ib.bin_code separator '\\t') from item_bins ib where ib.item_id = i.id) as item_bins",
      ),
    )
    .orderBy([{ column: "o.id" }, { column: "l.line_no" }]);
  const byOrder = new Map<number, WaveOrder>();
  for (const r of rows) {
    let o = byOrder.get(r.order_id);
    if (!o) {
      o = {
        orderId: r.order_id,
        orderNumber: r.order_number,
        cutoffAt: r.cutoff_at ? new Date(r.cutoff_at).toISOString() : null,
        priority: r.priority,
        lines: [],
      };
      byOrder.set(r.order_id, o);
    }
    o.lines.push({
      lineId: r.line_id,
      sku: r.sku,
      binCode: r.bin_code ?? "",
      ...(r.bin_code ? {} : { itemBins: r.item_bins ? String(r.item_bins).split("\t") : [] }),
      quantity: r.quantity,
      unitWeightG: r.unit_weight_g,
    });
  }
  return [...byOrder.values()];
}

/** Orders of the wave that no batch of its plan holds. */
function ordersInNoBatch(trx: Knex.Transaction, waveId: number) {
  return trx("wave_orders as wo")
    .where("wo.wave_id", waveId)
    .whereNotExists(
      trx("order_lines as l")
        .join("batch_lines as bl", "bl.order_line_id", "l.id")
        .join("batches as b", "b.id", "bl.batch_id")
        .whereRaw("l.order_id = wo.order_id")
        .andWhere("b.wave_id", waveId)
        .select(trx.raw("1")),
    )
    .pluck("wo.order_id");
}

/**
 * planned → released, once: a second release of the same version finds nothing to change. Orders no
 * batch holds leave the wave and are open again, each with its reason as a note, so a new wave can
 * take them once the planner has fixed what stopped them. The release mail links to `mailOrigin`.
 */
export async function releaseWave(
  siteId: number,
  waveId: number,
  expectedVersion: number,
  userId: string | null,
  mailOrigin: string,
): Promise<"released" | "stale" | "not-planned"> {
  return db().transaction(async (trx) => {
    const w = await trx("waves")
      .where({ id: waveId, site_id: siteId })
      .forUpdate()
      .first("version", "status", "name", "unbatchable");
    if (!w) return "stale";
    if (w.status !== "planned") return w.status === "released" ? "stale" : "not-planned";
    if (w.version !== expectedVersion) return "stale";
    const leaving = await ordersInNoBatch(trx, waveId);
    const reasons = new Map(
      (w.unbatchable ? json<UnbatchableOrder[]>(w.unbatchable) : []).map((u) => [u.orderId, u.reason]),
    );
    for (const orderId of leaving) {
      const reason = reasons.get(orderId) ?? "No batch of the plan held it.";
      await trx("orders")
        .where({ id: orderId })
        .update({
          status: "open",
          unbatched_note: `Not batched in wave “${w.name}”, which was released without it: ${reason}`.slice(0, 1000),
        });
    }
    for (const part of chunks(leaving))
      await trx("wave_orders").where({ wave_id: waveId }).whereIn("order_id", part).delete();
    await trx("waves")
      .where({ id: waveId })
      .update({ status: "released", version: expectedVersion + 1, released_at: trx.fn.now(3), released_by: userId });
    await trx("batches").where({ wave_id: waveId }).update({ status: "released" });
    await trx("orders")
      .whereIn("id", trx("wave_orders").where({ wave_id: waveId }).select("order_id"))
      .update({ status: "released" });
    // A wave none of whose orders could be batched only hands its orders back: no batches to announce.
    if (await trx("batches").where({ wave_id: waveId }).first("id"))
      await queueWaveReleasedMail(trx, waveId, mailOrigin);
    return "released";
  });
}

/**
 * Drops a wave that was never released and hands all its orders back to open: the way out for a wave
 * that cannot be planned as it stands (too big for the time limit, say) or is no longer wanted.
 */
export async function discardWave(
  siteId: number,
  waveId: number,
  expectedVersion: number,
  beforeCommit?: (trx: Knex.Transaction, orders: number) => Promise<void>,
): Promise<{ outcome: "discarded"; orders: number } | { outcome: "missing" | "released" | "stale" }> {
  return db().transaction(async (trx) => {
    const w = await trx("waves").where({ id: waveId, site_id: siteId }).forUpdate().first("version", "status");
    if (!w) return { outcome: "missing" as const };
    if (w.status === "released") return { outcome: "released" as const };
    if (w.version !== expectedVersion) return { outcome: "stale" as const };
    const orderIds: number[] = await trx("wave_orders").where({ wave_id: waveId }).pluck("order_id");
    for (const part of chunks(orderIds)) await trx("orders").whereIn("id", part).update({ status: "open" });
    // Its wave_orders, batches and their lines and print history go with it (foreign keys cascade).
    await trx("waves").where({ id: waveId }).delete();
    await beforeCommit?.(trx, orderIds.length);
    return { outcome: "discarded" as const, orders: orderIds.length };
  });
}

/** Open orders that no wave has claimed yet and that have lines, matching the planner's filter. */
function unclaimedOpenOrders(siteId: number, filter: WaveFilter) {
  const q = db()("orders as o")
    .leftJoin("wave_orders as wo", "wo.order_id", "o.id")
    .where({ "o.site_id": siteId, "o.status": "open" })
    .whereNull("wo.order_id")
    .whereExists(db()("order_lines as l").whereRaw("l.order_id = o.id").select(db().raw("1")));
  const cutoff = filter.cutoffBefore;
  if (cutoff) {
    if (filter.includeNoCutoff) q.where((w) => w.where("o.cutoff_at", "<=", cutoff).orWhereNull("o.cutoff_at"));
    else q.where("o.cutoff_at", "<=", cutoff);
  }
  if (filter.priorities?.length) q.whereIn("o.priority", filter.priorities);
  return q;
}

/** Open orders that no wave has claimed yet, matching the planner's filter, most urgent first. */
export async function unclaimedOpenOrderIds(siteId: number, filter: WaveFilter): Promise<number[]> {
  const rows = await unclaimedOpenOrders(siteId, filter)
    .orderByRaw("o.cutoff_at is null, o.cutoff_at, o.priority, o.order_number")
    .select("o.id");
  return rows.map((r: { id: number }) => r.id);
}

const PREVIEW_EXAMPLES = 5;

/** What a new wave with this filter would take, and which of its lines no bin of the layout version holds. */
export async function previewWave(
  siteId: number,
  layoutVersionId: number,
  filter: WaveFilter,
): Promise<WavePreviewDTO> {
  const ids = () => unclaimedOpenOrders(siteId, filter).select("o.id");
  const noBinOnLayout = (q: Knex.QueryBuilder) =>
    q.whereNotExists(
      db()("item_bins as ib")
        .join("layout_bins as lb", "lb.code", "ib.bin_code")
        .whereRaw("ib.item_id = l.item_id")
        .andWhere("lb.layout_version_id", layoutVersionId)
        .select(db().raw("1")),
    );
  const [orders, lines, off, examples] = await Promise.all([
    db().from(ids().as("x")).first(db().raw("count(*) as n")),
    db()("order_lines as l").whereIn("l.order_id", ids()).first(db().raw("count(*) as n")),
    noBinOnLayout(db()("order_lines as l").whereIn("l.order_id", ids())).first(
      db().raw("count(*) as n"),
      db().raw("count(distinct l.order_id) as orders"),
    ),
    noBinOnLayout(
      db()("order_lines as l")
        .join("orders as o", "o.id", "l.order_id")
        .join("items as i", "i.id", "l.item_id")
        .whereIn("l.order_id", ids()),
    )
      .orderByRaw("o.cutoff_at is null, o.cutoff_at, o.priority, o.order_number, l.line_no")
      .limit(PREVIEW_EXAMPLES)
      .select("o.order_number", "i.sku", "l.item_id"),
  ]);
  // Counted without the cut-off, which would leave them all out: the form offers to include them.
  const without = await unclaimedOpenOrders(siteId, { priorities: filter.priorities })
    .whereNull("o.cutoff_at")
    .first(db().raw("count(*) as n"));
  const bins = examples.length
    ? ((await db()("item_bins")
        .whereIn(
          "item_id",
          examples.map((e: { item_id: number }) => e.item_id),
        )
        .orderBy(["item_id", "rank", "bin_code"])
        .select("item_id", "bin_code")) as { item_id: number; bin_code: string }[])
    : [];
  return {
    orders: Number(orders?.n ?? 0),
    lines: Number(lines?.n ?? 0),
    ordersWithoutCutoff: Number(without?.n ?? 0),
    offLayout: {
      orders: Number(off?.orders ?? 0),
      lines: Number(off?.n ?? 0),
      examples: examples.map((e: { order_number: string; sku: string; item_id: number }) => ({
        orderNumber: e.order_number,
        sku: e.sku,
        binCodes: bins.filter((b) => b.item_id === e.item_id).map((b) => b.bin_code),
      })),
    },
  };
}

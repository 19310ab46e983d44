import "server-only";
import type { Knex } from "knex";
import { db } from "./knex";
import { queueWaveReleasedMail } from "./wave-mail";
import type { WaveOrder } from "@/lib/batching/types";

export type WaveSettings = {
  totesPerCart: number;
  maxLines: number;
  maxWeightG: number;
  depotId: string;
  dropoffId: string;
  method: "first-come" | "savings";
};

export type WaveStatus = "draft" | "planned" | "released";

export type WaveDTO = {
  id: number;
  name: string;
  status: WaveStatus;
  version: number;
  layoutVersionId: number;
  layoutVersionNumber: number;
  floorPlanId: number;
  floorPlanName: string;
  settings: WaveSettings;
  orderCount: number;
  batchCount: number;
  distanceMm: number | null;
  baselineMm: number | null;
  unbatchable: { orderId: number; orderNumber?: string; reason: string }[];
  createdAt: string;
  plannedAt: string | null;
  releasedAt: string | null;
  releasedBy: string | null;
};

const json = <T>(v: unknown): T => (typeof v === "string" ? JSON.parse(v) : v) as T;
const iso = (d: Date | null) => (d ? d.toISOString() : null);

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
export async function createWave(siteId: number, input: { name: string; layoutVersionId: number; settings: WaveSettings; orderIds: number[] }, userId: string): Promise<number> {
  return db().transaction(async (trx) => {
    const orders = await trx("orders").where({ site_id: siteId }).whereIn("id", input.orderIds).forUpdate().select("id", "order_number", "status");
    const taken = await trx("wave_orders").whereIn("order_id", input.orderIds).select("order_id");
    const takenIds = new Set(taken.map((t: { order_id: number }) => t.order_id));
    const bad = orders.filter((o: { id: number; status: string }) => o.status !== "open" || takenIds.has(o.id)).map((o: { order_number: string }) => o.order_number);
    if (bad.length) throw new OrdersTakenError(bad);
    if (orders.length !== new Set(input.orderIds).size) throw new OrdersTakenError(["(some orders no longer exist)"]);
    const [id] = await trx("waves").insert({ site_id: siteId, name: input.name.trim(), layout_version_id: input.layoutVersionId, settings: JSON.stringify(input.settings), created_by: userId });
    const waveId = Number(id);
    for (let i = 0; i < input.orderIds.length; i += 1000) {
      const chunk = input.orderIds.slice(i, i + 1000);
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
      db().raw("(select group_concat(ib.bin_code order by ib.`rank`, ib.bin_code separator '\\t') from item_bins ib where ib.item_id = i.id) as item_bins"),
    )
    .orderBy([{ column: "o.id" }, { column: "l.line_no" }]);
  const byOrder = new Map<number, WaveOrder>();
  for (const r of rows) {
    let o = byOrder.get(r.order_id);
    if (!o) {
      o = { orderId: r.order_id, orderNumber: r.order_number, cutoffAt: r.cutoff_at ? new Date(r.cutoff_at).toISOString() : null, priority: r.priority, lines: [] };
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

export type StoredBatch = {
  lineCount: number;
  toteCount: number;
  weightG: number;
  distanceMm: number;
  baselineMm: number;
  optimal: boolean;
  method: string;
  stops: { accessPoint: number; x: number; y: number }[];
  lines: { orderLineId: number; stopSeq: number; tote: number; binCode: string }[];
};

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
  unbatchable: WaveDTO["unbatchable"],
  beforeCommit?: (trx: Knex.Transaction) => Promise<void>,
): Promise<boolean> {
  return db().transaction(async (trx) => {
    const w = await trx("waves").where({ id: waveId }).forUpdate().first("version", "status");
    if (!w || w.version !== expectedVersion || w.status === "released") return false;
    await trx("batches").where({ wave_id: waveId }).delete();
    for (const [i, b] of batches.entries()) {
      const [id] = await trx("batches").insert({
        wave_id: waveId,
        number: i + 1,
        line_count: b.lineCount,
        tote_count: b.toteCount,
        weight_g: b.weightG,
        distance_mm: b.distanceMm,
        baseline_mm: b.baselineMm,
        optimal: b.optimal,
        method: b.method,
      });
      const batchId = Number(id);
      if (b.stops.length) await insertChunks(trx, "batch_stops", b.stops.map((s, seq) => ({ batch_id: batchId, seq: seq + 1, access_point: s.accessPoint, x: s.x, y: s.y })));
      if (b.lines.length) await insertChunks(trx, "batch_lines", b.lines.map((l) => ({ order_line_id: l.orderLineId, batch_id: batchId, stop_seq: l.stopSeq, tote: l.tote, bin_code: l.binCode })));
    }
    await trx("waves")
      .where({ id: waveId })
      .update({ status: "planned", version: expectedVersion + 1, distance_mm: totals.distanceMm, baseline_mm: totals.baselineMm, unbatchable: JSON.stringify(unbatchable), planned_at: trx.fn.now(3) });
    await beforeCommit?.(trx);
    return true;
  });
}

async function insertChunks(trx: Knex.Transaction, table: string, rows: Record<string, unknown>[]) {
  for (let i = 0; i < rows.length; i += 1000) await trx(table).insert(rows.slice(i, i + 1000));
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
 * take them once the planner has fixed what stopped them.
 */
export async function releaseWave(siteId: number, waveId: number, expectedVersion: number, userId: string | null): Promise<"released" | "stale" | "not-planned"> {
  return db().transaction(async (trx) => {
    const w = await trx("waves").where({ id: waveId, site_id: siteId }).forUpdate().first("version", "status", "name", "unbatchable");
    if (!w) return "stale";
    if (w.status !== "planned") return w.status === "released" ? "stale" : "not-planned";
    if (w.version !== expectedVersion) return "stale";
    const leaving = await ordersInNoBatch(trx, waveId);
    const reasons = new Map((w.unbatchable ? json<WaveDTO["unbatchable"]>(w.unbatchable) : []).map((u) => [u.orderId, u.reason]));
    for (const orderId of leaving) {
      const reason = reasons.get(orderId) ?? "No batch of the plan held it.";
      await trx("orders").where({ id: orderId }).update({ status: "open", unbatched_note: `Not batched in wave “${w.name}”, which was released without it: ${reason}`.slice(0, 1000) });
    }
    for (let i = 0; i < leaving.length; i += 1000) await trx("wave_orders").where({ wave_id: waveId }).whereIn("order_id", leaving.slice(i, i + 1000)).delete();
    await trx("waves").where({ id: waveId }).update({ status: "released", version: expectedVersion + 1, released_at: trx.fn.now(3), released_by: userId });
    await trx("batches").where({ wave_id: waveId }).update({ status: "released" });
    await trx("orders").whereIn("id", trx("wave_orders").where({ wave_id: waveId }).select("order_id")).update({ status: "released" });
    // A wave none of whose orders could be batched only hands its orders back: no batches to announce.
    if (await trx("batches").where({ wave_id: waveId }).first("id")) await queueWaveReleasedMail(trx, waveId);
    return "released";
  });
}

/**
 * Drops a wave that was never released and hands all its orders back to open: the way out for a wave
 * that cannot be planned as it stands (too big for the time limit, say) or is no longer wanted.
 */
export async function discardWave(siteId: number, waveId: number, expectedVersion: number): Promise<{ outcome: "discarded"; orders: number } | { outcome: "missing" | "released" | "stale" }> {
  return db().transaction(async (trx) => {
    const w = await trx("waves").where({ id: waveId, site_id: siteId }).forUpdate().first("version", "status");
    if (!w) return { outcome: "missing" as const };
    if (w.status === "released") return { outcome: "released" as const };
    if (w.version !== expectedVersion) return { outcome: "stale" as const };
    const orderIds: number[] = await trx("wave_orders").where({ wave_id: waveId }).pluck("order_id");
    for (let i = 0; i < orderIds.length; i += 1000) await trx("orders").whereIn("id", orderIds.slice(i, i + 1000)).update({ status: "open" });
    // Its wave_orders, batches and their lines and print history go with it (foreign keys cascade).
    await trx("waves").where({ id: waveId }).delete();
    return { outcome: "discarded" as const, orders: orderIds.length };
  });
}

export type BatchSummaryDTO = {
  id: number;
  number: number;
  lineCount: number;
  toteCount: number;
  weightG: number;
  stopCount: number;
  distanceMm: number;
  baselineMm: number;
  optimal: boolean;
  method: string;
  status: string;
  pickedLines: number;
  shortLines: number;
};

/** The wave's batches with their counts; only batch `number` when given (a handheld opening one batch). */
export async function listBatches(waveId: number, number?: number): Promise<BatchSummaryDTO[]> {
  const rows = await db()("batches as b")
    .where("b.wave_id", waveId)
    .modify((q) => (number === undefined ? q : q.where("b.number", number)))
    .select(
      "b.*",
      db().raw("(select count(*) from batch_stops s where s.batch_id = b.id) as stop_count"),
      db().raw("(select count(*) from batch_lines l where l.batch_id = b.id and l.pick_status = 'picked') as picked_count"),
      db().raw("(select count(*) from batch_lines l where l.batch_id = b.id and l.pick_status = 'short') as short_count"),
    )
    .orderBy("b.number");
  return rows.map((r: Record<string, unknown>) => ({
    id: Number(r.id),
    number: Number(r.number),
    lineCount: Number(r.line_count),
    toteCount: Number(r.tote_count),
    weightG: Number(r.weight_g),
    stopCount: Number(r.stop_count),
    distanceMm: Number(r.distance_mm),
    baselineMm: Number(r.baseline_mm),
    optimal: Boolean(r.optimal),
    method: String(r.method),
    status: String(r.status),
    pickedLines: Number(r.picked_count),
    shortLines: Number(r.short_count),
  }));
}

export type ShortPickDTO = { batchNumber: number; orderNumber: string; binCode: string; sku: string; ordered: number; picked: number; reason: string | null; at: string | null };

/** Lines a picker could not fill completely: the planner's follow-up list. */
export async function shortPicksOfWave(waveId: number): Promise<ShortPickDTO[]> {
  const rows = await db()("batch_lines as bl")
    .join("batches as b", "b.id", "bl.batch_id")
    .join("order_lines as l", "l.id", "bl.order_line_id")
    .join("orders as o", "o.id", "l.order_id")
    .join("items as i", "i.id", "l.item_id")
    .where({ "b.wave_id": waveId, "bl.pick_status": "short" })
    .select("b.number", "o.order_number", "bl.bin_code", "i.sku", "l.quantity", "bl.picked_qty", "bl.short_reason", "bl.confirmed_at")
    .orderBy([{ column: "b.number" }, { column: "bl.stop_seq" }]);
  return rows.map((r: { number: number; order_number: string; bin_code: string; sku: string; quantity: number; picked_qty: number | null; short_reason: string | null; confirmed_at: Date | null }) => ({
    batchNumber: r.number,
    orderNumber: r.order_number,
    binCode: r.bin_code,
    sku: r.sku,
    ordered: r.quantity,
    picked: r.picked_qty ?? 0,
    reason: r.short_reason,
    at: r.confirmed_at ? r.confirmed_at.toISOString() : null,
  }));
}

export type BatchDetailDTO = BatchSummaryDTO & {
  stops: { seq: number; x: number; y: number; accessPoint: number; lines: { orderNumber: string; tote: number; sku: string; description: string; quantity: number; uom: string; binCode: string; unitWeightG: number }[] }[];
};

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
      .select("bl.stop_seq", "bl.tote", "bl.bin_code", "o.order_number", "i.sku", "i.description", "i.uom", "i.unit_weight_g", "l.quantity")
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
        .map((l: { order_number: string; tote: number; sku: string; description: string; quantity: number; uom: string; bin_code: string; unit_weight_g: number }) => ({
          orderNumber: l.order_number,
          tote: l.tote,
          sku: l.sku,
          description: l.description,
          quantity: l.quantity,
          uom: l.uom,
          binCode: l.bin_code,
          unitWeightG: l.unit_weight_g,
        })),
    })),
  };
}

export type WaveFilter = { cutoffBefore?: Date; priorities?: number[] };

/** Open orders that no wave has claimed yet and that have lines, matching the planner's filter. */
function unclaimedOpenOrders(siteId: number, filter: WaveFilter) {
  const q = db()("orders as o")
    .leftJoin("wave_orders as wo", "wo.order_id", "o.id")
    .where({ "o.site_id": siteId, "o.status": "open" })
    .whereNull("wo.order_id")
    .whereExists(db()("order_lines as l").whereRaw("l.order_id = o.id").select(db().raw("1")));
  if (filter.cutoffBefore) q.where("o.cutoff_at", "<=", filter.cutoffBefore);
  if (filter.priorities?.length) q.whereIn("o.priority", filter.priorities);
  return q;
}

/** Open orders that no wave has claimed yet, matching the planner's filter, most urgent first. */
export async function unclaimedOpenOrderIds(siteId: number, filter: WaveFilter): Promise<number[]> {
  const rows = await unclaimedOpenOrders(siteId, filter).orderByRaw("o.cutoff_at is null, o.cutoff_at, o.priority, o.order_number").select("o.id");
  return rows.map((r: { id: number }) => r.id);
}

export type WavePreviewDTO = {
  /** What starting a wave with this filter takes now. */
  orders: number;
  lines: number;
  ordersWithoutCutoff: number;
  /** Lines whose item has no bin on the layout version: their orders cannot be batched on it. */
  offLayout: { orders: number; lines: number; examples: { orderNumber: string; sku: string; binCodes: string[] }[] };
};

const PREVIEW_EXAMPLES = 5;

/** What a new wave with this filter would take, and which of its lines no bin of the layout version holds. */
export async function previewWave(siteId: number, layoutVersionId: number, filter: WaveFilter): Promise<WavePreviewDTO> {
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
    noBinOnLayout(db()("order_lines as l").whereIn("l.order_id", ids())).first(db().raw("count(*) as n"), db().raw("count(distinct l.order_id) as orders")),
    noBinOnLayout(db()("order_lines as l").join("orders as o", "o.id", "l.order_id").join("items as i", "i.id", "l.item_id").whereIn("l.order_id", ids()))
      .orderByRaw("o.cutoff_at is null, o.cutoff_at, o.priority, o.order_number, l.line_no")
      .limit(PREVIEW_EXAMPLES)
      .select("o.order_number", "i.sku", "l.item_id"),
  ]);
  const without = await unclaimedOpenOrders(siteId, filter).whereNull("o.cutoff_at").first(db().raw("count(*) as n"));
  const bins = examples.length
    ? ((await db()("item_bins").whereIn("item_id", examples.map((e: { item_id: number }) => e.item_id)).orderBy(["item_id", "rank", "bin_code"]).select("item_id", "bin_code")) as { item_id: number; bin_code: string }[])
    : [];
  return {
    orders: Number(orders?.n ?? 0),
    lines: Number(lines?.n ?? 0),
    ordersWithoutCutoff: Number(without?.n ?? 0),
    offLayout: {
      orders: Number(off?.orders ?? 0),
      lines: Number(off?.n ?? 0),
      examples: examples.map((e: { order_number: string; sku: string; item_id: number }) => ({ orderNumber: e.order_number, sku: e.sku, binCodes: bins.filter((b) => b.item_id === e.item_id).map((b) => b.bin_code) })),
    },
  };
}

export type PrintOutcome = { unknown: number[]; batchCount: number } | { before: Map<number, number> };

/**
 * Counts one print of each listed batch (each once, however often listed) and returns how often each
 * had been printed before. The history is per wave and batch number, so it outlives re-planning.
 * Nothing is counted when a number names no batch of the wave.
 */
export async function recordPrinted(waveId: number, numbers: number[]): Promise<PrintOutcome> {
  const wanted = [...new Set(numbers)].sort((a, b) => a - b);
  return db().transaction(async (trx) => {
    // The wave row's lock keeps a re-plan from renumbering the batches between the check and the count.
    await trx("waves").where({ id: waveId }).forUpdate().first("id");
    const have = new Set<number>(await trx("batches").where({ wave_id: waveId }).whereIn("number", wanted).pluck("number"));
    const unknown = wanted.filter((n) => !have.has(n));
    if (unknown.length) {
      const count = await trx("batches").where({ wave_id: waveId }).first(trx.raw("count(*) as n"));
      return { unknown, batchCount: Number(count?.n ?? 0) };
    }
    const rows = await trx("wave_batch_prints").where({ wave_id: waveId }).whereIn("number", wanted).forUpdate().select("number", "print_count");
    await trx("wave_batch_prints")
      .insert(wanted.map((number) => ({ wave_id: waveId, number, print_count: 1, last_printed_at: trx.fn.now(3) })))
      .onConflict(["wave_id", "number"])
      .merge({ print_count: trx.raw("print_count + 1"), last_printed_at: trx.fn.now(3) });
    const before = new Map<number, number>(wanted.map((n) => [n, 0]));
    for (const r of rows as { number: number; print_count: number }[]) before.set(r.number, r.print_count);
    return { before };
  });
}

export async function printCounts(waveId: number): Promise<Map<number, number>> {
  const rows = await db()("wave_batch_prints").where({ wave_id: waveId }).select("number", "print_count");
  return new Map(rows.map((r: { number: number; print_count: number }) => [r.number, r.print_count]));
}

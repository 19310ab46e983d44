import type { Knex } from "knex";
import { DEMO_SITE } from "./demo/accounts";
import { demoItems, demoOrders, DEMO_CART_LIMITS, type DemoOrder } from "./demo/orders";
import { batchOrders } from "../../lib/batching/batching";
import { loadHighs } from "../../lib/routing/lp/highs";
import { toStoredBatch } from "../../lib/waves/to-stored";
import { loadLayoutGraph } from "../layout-versions";
import { createWave, releaseWave, getWave } from "../waves";
import { storePlan } from "../batches";
import type { WaveSettings } from "../../lib/contracts/waves";
import { appOrigin } from "../../lib/mail/config";
import { closeDb } from "../knex";
import { DEMO_FLOOR_PLAN } from "./02_demo_floor_plan";

// The invented week at Bramblegate: the item master, five days of orders, Monday's wave released
// and Tuesday morning's planned. Idempotent: a site that already has items is left alone.
export async function seed(knex: Knex): Promise<void> {
  const site = await knex("sites").where({ code: DEMO_SITE.code }).first("id");
  if (await knex("items").where({ site_id: site.id }).first("id")) return;
  const planner = await knex("users").where({ site_id: site.id, role: "planner" }).orderBy("created_at").first("id");
  const plan = await knex("floor_plans").where({ site_id: site.id, name: DEMO_FLOOR_PLAN }).first("id");
  const version = await knex("layout_versions").where({ floor_plan_id: plan.id, number: 1 }).first("id", "document");
  const document = JSON.parse(version.document);
  const items = demoItems(document);
  const orders = demoOrders(items);
  try {
    await knex.transaction(async (trx) => {
      for (const it of items) {
        const [id] = await trx("items").insert({
          site_id: site.id,
          sku: it.sku,
          description: it.description,
          uom: it.unitOfMeasure,
          unit_weight_g: it.unitWeightG,
        });
        await trx("item_bins").insert({ item_id: id, bin_code: it.binCode, rank: 1 });
      }
      const itemIds = new Map(
        (await trx("items").where({ site_id: site.id }).select("id", "sku")).map((r: { id: number; sku: string }) => [
          r.sku,
          r.id,
        ]),
      );
      for (const o of orders) {
        const [orderId] = await trx("orders").insert({
          site_id: site.id,
          order_number: o.orderNumber,
          customer_ref: `${o.customer} / ${o.customerRef}`,
          priority: o.priority,
          cutoff_at: o.cutoffAt ? new Date(o.cutoffAt) : null,
        });
        await trx("order_lines").insert(
          o.lines.map((l, i) => ({
            order_id: orderId,
            line_no: i + 1,
            item_id: itemIds.get(l.sku),
            quantity: l.quantity,
          })),
        );
      }
    });
    const settings: WaveSettings = {
      ...DEMO_CART_LIMITS,
      depotId: document.depots[0].id,
      dropoffId: document.dropoffs[0].id,
      method: "savings",
    };
    const ids = async (day: string, before?: string) =>
      (
        await knex("orders")
          .where({ site_id: site.id })
          .where("order_number", "like", `FS-${day}-%`)
          .andWhere((q) => (before ? q.where("cutoff_at", "<=", new Date(before)) : q))
          .select("id")
      ).map((r: { id: number }) => r.id);
    const monday = await createWave(
      site.id,
      { name: "Monday 23 November", layoutVersionId: version.id, settings, orderIds: await ids("261123") },
      planner.id,
    );
    const tuesday = await createWave(
      site.id,
      {
        name: "Tuesday 24 November, morning",
        layoutVersionId: version.id,
        settings,
        orderIds: await ids("261124", "2026-11-24T12:00:00Z"),
      },
      planner.id,
    );
    const { graph, matrix } = await loadLayoutGraph(version.id);
    for (const waveId of [monday, tuesday]) {
      const waveOrders = orders.filter((o) => o.orderNumber.startsWith(waveId === monday ? "FS-261123" : "FS-261124"));
      const rows = await knex("orders")
        .whereIn("id", knex("wave_orders").where({ wave_id: waveId }).select("order_id"))
        .select("id", "order_number");
      const lines = await knex("order_lines")
        .whereIn(
          "order_id",
          rows.map((r: { id: number }) => r.id),
        )
        .select("id", "order_id", "line_no");
      const byNumber = new Map(waveOrders.map((o) => [o.orderNumber, o]));
      // Give the planner's orders their database ids, as the wave planner does.
      const planned: DemoOrder[] = rows.map((r: { id: number; order_number: string }) => {
        const o = byNumber.get(r.order_number)!;
        return {
          ...o,
          orderId: r.id,
          lines: o.lines.map((l, i) => ({
            ...l,
            lineId: lines.find((x: { order_id: number; line_no: number }) => x.order_id === r.id && x.line_no === i + 1)
              .id,
          })),
        };
      });
      await loadHighs();
      const result = batchOrders(graph, matrix, planned, DEMO_CART_LIMITS, {
        method: "savings",
        from: settings.depotId,
        to: settings.dropoffId,
      });
      const byId = new Map(planned.map((o) => [o.orderId, o]));
      const stored = result.batches.map((b) => toStoredBatch(graph, b, byId));
      const totals = {
        distanceMm: stored.reduce((a, b) => a + b.distanceMm, 0),
        baselineMm: stored.reduce((a, b) => a + b.baselineMm, 0),
      };
      const wave = await getWave(site.id, waveId);
      await storePlan(waveId, wave!.version, stored, totals, result.unbatchable);
    }
    const mondayWave = await getWave(site.id, monday);
    await releaseWave(site.id, monday, mondayWave!.version, planner.id, appOrigin());
    // Monday's first two batches are on Priya's handheld; the rest wait to be taken.
    const picker = await knex("users").where({ site_id: site.id, email: "picker@bramblegate.example" }).first("id");
    await knex("batches")
      .where({ wave_id: monday })
      .whereIn("number", [1, 2])
      .update({ assigned_to: picker.id, taken_at: knex.fn.now(3) });
  } finally {
    await closeDb();
  }
}

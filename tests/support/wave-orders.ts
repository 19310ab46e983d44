import { db } from "@/db/knex";

/**
 * Items and open orders a test writes straight into the database (the import is tested elsewhere),
 * and takes out again with cleanUp(): waves first, so no released batch of theirs waits for pickers.
 */
export class TestOrders {
  readonly orderIds: number[] = [];
  readonly itemIds: number[] = [];
  readonly waveIds: number[] = [];

  async siteId(): Promise<number> {
    const r = await db()("layout_versions as v")
      .join("floor_plans as p", "p.id", "v.floor_plan_id")
      .where("v.id", 1)
      .first("p.site_id");
    return r.site_id;
  }

  async addItem(sku: string, bins: string[]): Promise<number> {
    const [id] = await db()("items").insert({
      site_id: await this.siteId(),
      sku,
      description: `Test item ${sku}`,
      uom: "EA",
      unit_weight_g: 200,
    });
    this.itemIds.push(Number(id));
    if (bins.length)
      await db()("item_bins").insert(bins.map((bin_code, i) => ({ item_id: Number(id), bin_code, rank: i + 1 })));
    return Number(id);
  }

  async addOrder(orderNumber: string, cutoff: string, items: number[]): Promise<number> {
    const [id] = await db()("orders").insert({
      site_id: await this.siteId(),
      order_number: orderNumber,
      priority: 2,
      cutoff_at: new Date(cutoff),
      status: "open",
    });
    this.orderIds.push(Number(id));
    await db()("order_lines").insert(
      items.map((item_id, i) => ({ order_id: Number(id), line_no: i + 1, item_id, quantity: 1 })),
    );
    return Number(id);
  }

  /** Items of the demo master with a bin on layout version 1. */
  async itemsOnLayout(n: number): Promise<number[]> {
    return db()("items as i")
      .join("item_bins as ib", "ib.item_id", "i.id")
      .join("layout_bins as lb", function () {
        this.on("lb.code", "=", "ib.bin_code").andOn("lb.layout_version_id", "=", db().raw("1"));
      })
      .where("i.site_id", await this.siteId())
      .distinct("i.id")
      .orderBy("i.id")
      .limit(n)
      .pluck("i.id");
  }

  async cleanUp(): Promise<void> {
    if (this.waveIds.length) await db()("waves").whereIn("id", this.waveIds).delete();
    if (this.orderIds.length) await db()("orders").whereIn("id", this.orderIds).delete();
    if (this.itemIds.length) await db()("items").whereIn("id", this.itemIds).delete();
  }
}

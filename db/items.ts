import "server-only";
import type { Knex } from "knex";
import { db } from "./knex";
import type { ItemRecord } from "@/lib/imports/items";
import { chunks } from "./rows";
import type { ItemDTO } from "@/lib/contracts/items";

const CHUNK = 500;

export async function listItems(siteId: number): Promise<ItemDTO[]> {
  const items = await db()("items")
    .where({ site_id: siteId })
    .orderBy("sku")
    .select("id", "sku", "description", "uom", "unit_weight_g");
  const bins = await db()("item_bins as b")
    .join("items as i", "i.id", "b.item_id")
    .where("i.site_id", siteId)
    .orderBy(["b.item_id", "b.rank"])
    .select("b.item_id", "b.bin_code");
  const byItem = new Map<number, string[]>();
  for (const b of bins as { item_id: number; bin_code: string }[]) {
    const list = byItem.get(b.item_id) ?? [];
    list.push(b.bin_code);
    byItem.set(b.item_id, list);
  }
  const flagged = new Set(
    (await db()("bin_replenishments")
      .where({ site_id: siteId })
      .whereNotNull("open_bin")
      .pluck("bin_code")) as string[],
  );
  return (items as { id: number; sku: string; description: string; uom: string; unit_weight_g: number }[]).map((i) => {
    const replenishBins = (byItem.get(i.id) ?? []).filter((b) => flagged.has(b));
    return {
      sku: i.sku,
      description: i.description,
      uom: i.uom,
      unitWeightG: i.unit_weight_g,
      bins: byItem.get(i.id) ?? [],
      // Only when there is one: the export and the import's checks read the same shape as before.
      ...(replenishBins.length ? { replenishBins } : {}),
    };
  });
}

/** How many SKUs exist at the site already, ignoring case as the unique key does. */
async function existingIds(q: Knex, siteId: number, skus: readonly string[]): Promise<Map<string, number>> {
  const out = new Map<string, number>();
  for (const part of chunks(skus, CHUNK)) {
    const rows = await q("items").where({ site_id: siteId }).whereIn("sku", part).select("id", "sku");
    for (const r of rows as { id: number; sku: string }[]) out.set(r.sku.toUpperCase(), r.id);
  }
  return out;
}

/**
 * Inserts new SKUs and updates existing ones, replacing their bins, inside the caller's transaction.
 * Existing SKUs keep their id, so order lines that point at them stay valid.
 */
export async function upsertItems(
  trx: Knex.Transaction,
  siteId: number,
  items: readonly ItemRecord[],
): Promise<{ inserted: number; updated: number }> {
  const before = await existingIds(
    trx,
    siteId,
    items.map((i) => i.sku),
  );
  const now = new Date();
  for (const part of chunks(items, CHUNK)) {
    await trx("items")
      .insert(
        part.map((i) => ({
          site_id: siteId,
          sku: i.sku,
          description: i.description,
          uom: i.uom,
          unit_weight_g: i.unitWeightG,
          updated_at: now,
        })),
      )
      .onConflict(["site_id", "sku"])
      .merge(["description", "uom", "unit_weight_g", "updated_at"]);
  }
  const ids = await existingIds(
    trx,
    siteId,
    items.map((i) => i.sku),
  );
  const itemIds = [...ids.values()];
  for (const part of chunks(itemIds, CHUNK)) await trx("item_bins").whereIn("item_id", part).del();
  const binRows = items.flatMap((i) =>
    i.bins.map((code, k) => ({ item_id: ids.get(i.sku.toUpperCase())!, bin_code: code, rank: k + 1 })),
  );
  for (const part of chunks(binRows, CHUNK)) await trx("item_bins").insert(part);
  const updated = items.filter((i) => before.has(i.sku.toUpperCase())).length;
  return { inserted: items.length - updated, updated };
}

/**
 * The site's items among these SKUs, with how many of their bins exist in the layout version
 * (keys upper-cased: SKUs compare ignoring case).
 */
export async function itemsWithBinsInVersion(
  siteId: number,
  layoutVersionId: number,
  skus: readonly string[],
): Promise<Map<string, { itemId: number; binsInVersion: number }>> {
  const out = new Map<string, { itemId: number; binsInVersion: number }>();
  for (const part of chunks(skus, CHUNK)) {
    const rows = await db()("items as i")
      .leftJoin("item_bins as b", "b.item_id", "i.id")
      .leftJoin("layout_bins as l", function () {
        this.on("l.code", "=", "b.bin_code").andOn("l.layout_version_id", "=", db().raw("?", [layoutVersionId]));
      })
      .where("i.site_id", siteId)
      .whereIn("i.sku", part)
      .groupBy("i.id", "i.sku")
      .select("i.id", "i.sku", db().raw("count(l.code) as n"));
    for (const r of rows as { id: number; sku: string; n: number | string }[])
      out.set(r.sku.toUpperCase(), { itemId: r.id, binsInVersion: Number(r.n) });
  }
  return out;
}

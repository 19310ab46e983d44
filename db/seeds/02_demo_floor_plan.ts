import type { Knex } from "knex";
import { DEMO_SITE } from "./demo/accounts";
import { bramblegateDocument, bramblegateDraftDocument } from "./demo/floor-plan";
import { buildLayout, rackRunOfBins } from "../../lib/layout-versions/build";
import { createFloorPlan, saveDraft } from "../floor-plans";
import { insertLayoutVersion } from "../layout-versions";
import { closeDb } from "../knex";

export const DEMO_FLOOR_PLAN = "Bramblegate ground floor";

// Bramblegate as a published layout version 1 plus an open draft with one more change.
// Idempotent: a site that already has the plan keeps it as it is.
export async function seed(knex: Knex): Promise<void> {
  const site = await knex("sites").where({ code: DEMO_SITE.code }).first("id");
  const admin = await knex("users").where({ site_id: site.id, role: "admin" }).orderBy("created_at").first("id");
  if (await knex("floor_plans").where({ site_id: site.id, name: DEMO_FLOOR_PLAN }).first("id")) return;
  try {
    const published = bramblegateDocument();
    const id = await createFloorPlan(site.id, DEMO_FLOOR_PLAN, published, admin?.id ?? null);
    const { graph, matrix } = await buildLayout(published);
    await insertLayoutVersion({
      floorPlanId: id,
      fromDraftVersion: 1,
      document: published,
      graph,
      matrix,
      rackRunOfBin: rackRunOfBins(published),
      userId: admin?.id ?? null,
    });
    const saved = await saveDraft(site.id, id, 1, bramblegateDraftDocument(), admin?.id ?? null);
    if (!saved?.ok) throw new Error("could not save the demo draft");
  } finally {
    await closeDb();
  }
}

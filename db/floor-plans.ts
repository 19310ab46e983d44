import "server-only";
import type { Knex } from "knex";
import { db } from "./knex";
import { isDuplicateKey } from "./rows";
import type { EditorDocument } from "@/lib/floor-plan/document";
import type { DraftDTO, FloorPlanSummary } from "@/lib/contracts/floor-plans";

export async function listFloorPlans(siteId: number): Promise<FloorPlanSummary[]> {
  const plans = await db()("floor_plans as p")
    .join("floor_plan_drafts as d", "d.floor_plan_id", "p.id")
    .where("p.site_id", siteId)
    .select("p.id", "p.name", "d.version", "d.updated_at")
    .orderBy("p.name");
  const latest = await db()("layout_versions as v")
    .whereIn(
      "v.floor_plan_id",
      plans.map((p: { id: number }) => p.id),
    )
    .whereRaw("v.number = (select max(number) from layout_versions w where w.floor_plan_id = v.floor_plan_id)")
    .select("v.id", "v.floor_plan_id", "v.number", "v.published_at", "v.bin_count", "v.from_draft_version");
  return plans.map((p: { id: number; name: string; version: number; updated_at: Date }) => {
    const v = latest.find((l: { floor_plan_id: number }) => l.floor_plan_id === p.id);
    return {
      id: p.id,
      name: p.name,
      draftVersion: p.version,
      draftUpdatedAt: p.updated_at.toISOString(),
      latestVersion: v
        ? {
            id: v.id,
            number: v.number,
            publishedAt: v.published_at.toISOString(),
            binCount: v.bin_count,
            fromDraftVersion: v.from_draft_version,
          }
        : null,
    };
  });
}

export async function getFloorPlan(siteId: number, id: number): Promise<{ id: number; name: string } | null> {
  const r = await db()("floor_plans").where({ id, site_id: siteId }).first("id", "name");
  return r ?? null;
}

export class DuplicateFloorPlanError extends Error {}

export async function createFloorPlan(
  siteId: number,
  name: string,
  document: EditorDocument,
  userId: string | null,
  trx?: Knex,
): Promise<number> {
  const run = async (t: Knex) => {
    try {
      const [id] = await t("floor_plans").insert({ site_id: siteId, name: name.trim() });
      await t("floor_plan_drafts").insert({
        floor_plan_id: id,
        version: 1,
        document: JSON.stringify(document),
        updated_by: userId,
      });
      return Number(id);
    } catch (e) {
      if (isDuplicateKey(e)) throw new DuplicateFloorPlanError(name);
      throw e;
    }
  };
  return trx ? run(trx) : db().transaction(run);
}

export async function getDraft(siteId: number, floorPlanId: number): Promise<DraftDTO | null> {
  const r = await db()("floor_plan_drafts as d")
    .join("floor_plans as p", "p.id", "d.floor_plan_id")
    .leftJoin("users as u", "u.id", "d.updated_by")
    .where({ "d.floor_plan_id": floorPlanId, "p.site_id": siteId })
    .first("d.version", "d.document", "d.updated_at", "u.display_name");
  if (!r) return null;
  return {
    floorPlanId,
    version: r.version,
    document: JSON.parse(r.document),
    updatedAt: r.updated_at.toISOString(),
    updatedByName: r.display_name ?? null,
  };
}

export type SaveResult =
  | { ok: true; version: number }
  | { ok: false; current: { version: number; updatedAt: string; updatedByName: string | null } };

/** Saves only over the version the editor loaded; anything else is someone else's save and is kept. */
export async function saveDraft(
  siteId: number,
  floorPlanId: number,
  expectedVersion: number,
  document: EditorDocument,
  userId: string | null,
): Promise<SaveResult | null> {
  const changed = await db()("floor_plan_drafts")
    .where({ floor_plan_id: floorPlanId, version: expectedVersion })
    .whereExists(db()("floor_plans").where({ id: floorPlanId, site_id: siteId }).select(db().raw("1")))
    .update({
      document: JSON.stringify(document),
      version: expectedVersion + 1,
      updated_by: userId,
      updated_at: db().fn.now(3),
    });
  if (changed === 1) return { ok: true, version: expectedVersion + 1 };
  const current = await getDraft(siteId, floorPlanId);
  if (!current) return null;
  return {
    ok: false,
    current: { version: current.version, updatedAt: current.updatedAt, updatedByName: current.updatedByName },
  };
}

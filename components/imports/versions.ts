import "server-only";
import { listFloorPlans } from "@/db/floor-plans";
import { listLayoutVersions } from "@/db/layout-versions";
import type { VersionOption } from "./types";

/** Every published layout version at the site, newest of each floor plan first, for the import's choice. */
export async function layoutVersionOptions(siteId: number): Promise<VersionOption[]> {
  const plans = await listFloorPlans(siteId);
  const lists = await Promise.all(plans.filter((p) => p.latestVersion).map(async (p) => (await listLayoutVersions(siteId, p.id)).map((v) => ({ id: v.id, label: `${p.name} — version ${v.number}` }))));
  return lists.flat();
}

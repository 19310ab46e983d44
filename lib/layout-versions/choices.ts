import "server-only";
import { listSiteLayoutVersions } from "@/db/layout-versions";
import type { LayoutChoice, VersionOption } from "@/lib/contracts/layout-versions";

/** Every published layout version at the site, newest of each floor plan first, for the imports' choice. */
export async function importVersionOptions(siteId: number): Promise<VersionOption[]> {
  const versions = await listSiteLayoutVersions(siteId);
  return versions.map((v) => ({ id: v.id, label: `${v.floorPlanName} — version ${v.number}` }));
}

/** The newest version of each floor plan, with the points a cart may start and end at: a new wave's choice. */
export async function waveLayoutChoices(siteId: number): Promise<LayoutChoice[]> {
  const versions = await listSiteLayoutVersions(siteId, { latestOnly: true, withDocument: true });
  return versions.map((v) => ({
    id: v.id,
    label: `${v.floorPlanName}, version ${v.number}`,
    depots: v.document.depots.map((d) => ({ id: d.id, name: d.name })),
    dropoffs: [...v.document.dropoffs, ...v.document.depots].map((d) => ({ id: d.id, name: d.name })),
  }));
}

import type { Metadata } from "next";
import Link from "next/link";
import { requireRole } from "@/lib/auth/guard";
import { roleMay } from "@/lib/auth/permissions";
import { listFloorPlans } from "@/db/floor-plans";
import { getSite } from "@/db/sites";
import { formatDateTime } from "@/lib/format/dates";
import { PageHeader } from "@/components/PageHeader";
import { EmptyState } from "@/components/EmptyState";
import { NewFloorPlanForm } from "@/components/floor-plans/NewFloorPlanForm";

export const metadata: Metadata = { title: "Floor plans" };

export default async function FloorPlansPage() {
  const user = await requireRole("floorplans.read", "/floor-plans");
  const [plans, site] = await Promise.all([listFloorPlans(user.siteId), getSite(user.siteId)]);
  const style = site?.dateStyle;
  const canEdit = roleMay(user.role, "floorplans.edit");
  return (
    <>
      <PageHeader
        title="Floor plans"
        lead="The drawing of each warehouse floor: aisles, cross-aisles, rack runs, depots and drop-offs. Waves are planned on a published layout version, which never changes afterwards."
      />
      {plans.length === 0 ? (
        <EmptyState title="No floor plan yet">
          {canEdit
            ? "Start one below: give it a name and the floor's size."
            : "A layout admin has not drawn this site's floor yet."}
        </EmptyState>
      ) : (
        <ul className="grid gap-4 md:grid-cols-2">
          {plans.map((p) => (
            <li key={p.id} className="card flex flex-col gap-3">
              <h2>{p.name}</h2>
              <p className="text-ink-soft">
                Draft last saved {formatDateTime(p.draftUpdatedAt, style)}
                {p.latestVersion && p.latestVersion.fromDraftVersion === p.draftVersion
                  ? " — the same as the published version."
                  : p.latestVersion
                    ? " — it has changes not yet published."
                    : "."}
                <br />
                {p.latestVersion
                  ? `Published as version ${p.latestVersion.number} on ${formatDateTime(p.latestVersion.publishedAt, style)} with ${p.latestVersion.binCount.toLocaleString("en")} bins.`
                  : "Not published yet."}
              </p>
              <div className="flex flex-wrap gap-2">
                <Link className="btn-primary" href={`/floor-plans/${p.id}`}>
                  {canEdit ? "Open the draft" : "View the draft"}
                </Link>
                {p.latestVersion && (
                  <Link className="btn-quiet" href={`/floor-plans/${p.id}/versions/${p.latestVersion.number}`}>
                    Version {p.latestVersion.number}
                  </Link>
                )}
              </div>
            </li>
          ))}
        </ul>
      )}
      {canEdit && <NewFloorPlanForm />}
    </>
  );
}

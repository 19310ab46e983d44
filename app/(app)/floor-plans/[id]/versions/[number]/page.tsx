import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { requireRole } from "@/lib/auth/guard";
import { pageId } from "@/lib/http/page-params";
import { getFloorPlan } from "@/db/floor-plans";
import { getSite } from "@/db/sites";
import { formatDateTime } from "@/lib/format/dates";
import { getLayoutVersion, listLayoutBins } from "@/db/layout-versions";
import { VersionExplorer } from "@/components/floor-plans/VersionExplorer";
import { layoutGraph } from "@/lib/layout-versions/graph-cache";
import { binDistancesFromDepots } from "@/lib/layout-versions/depot-distances";

export const metadata: Metadata = { title: "Layout version" };

export default async function LayoutVersionPage({ params }: { params: Promise<{ id: string; number: string }> }) {
  const { id, number } = await params;
  const user = await requireRole("floorplans.read", `/floor-plans/${id}/versions/${number}`);
  const planId = pageId(id);
  const n = pageId(number);
  const plan = await getFloorPlan(user.siteId, planId);
  const version = plan ? await getLayoutVersion(user.siteId, plan.id, n) : null;
  if (!plan || !version) notFound();
  const [rows, { graph, matrix }, site] = await Promise.all([
    listLayoutBins(version.id),
    layoutGraph(version.id),
    getSite(user.siteId),
  ]);
  const fromDepot = binDistancesFromDepots(graph, matrix);
  const depotName = new Map(version.document.depots.map((d) => [d.id, d.name]));
  const bins = rows.map((b) => {
    const d = fromDepot.get(b.code) ?? null;
    return { ...b, fromDepot: d ? { depot: depotName.get(d.depot) ?? d.depot, mm: d.mm } : null };
  });
  return (
    <>
      <p className="mb-2 text-sm">
        <Link className="underline" href="/floor-plans">
          Floor plans
        </Link>{" "}
        ›{" "}
        <Link className="underline" href={`/floor-plans/${plan.id}`}>
          {plan.name}
        </Link>{" "}
        › version {version.number}
      </p>
      <h1>
        {plan.name}: layout version {version.number}
      </h1>
      <p className="mt-1 mb-5 text-ink-soft">
        Published {formatDateTime(version.publishedAt, site?.dateStyle)}
        {version.publishedByName ? ` by ${version.publishedByName}` : ""}. It never changes: waves planned on it keep
        their routes. {version.nodeCount} junctions, {version.edgeCount} corridors,{" "}
        {version.binCount.toLocaleString("en")} bins. Distance matrix checksum{" "}
        <code className="text-sm">{version.matrixSha256.slice(0, 16)}…</code>
      </p>
      <VersionExplorer layoutVersionId={version.id} document={version.document} bins={bins} />
    </>
  );
}

import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { requireRole } from "@/lib/auth/guard";
import { pageId } from "@/lib/http/page-params";
import { getWave } from "@/db/waves";
import { getBatch } from "@/db/batches";
import { getLayoutVersionById, getLayoutVersion } from "@/db/layout-versions";
import { getSite } from "@/db/sites";
import { layoutGraph } from "@/lib/layout-versions/graph-cache";
import { batchRouteCells } from "@/lib/waves/batch-route";
import { BatchRoute } from "@/components/waves/BatchRoute";
import { BatchLiveStatus } from "@/components/waves/BatchLiveStatus";
import { estimateSeconds, siteTiming, timingNote } from "@/lib/batching/estimate";
import { kilograms, metres, minutes, savingsPct } from "@/lib/format/units";
import { routeCertificateLine } from "@/lib/format/route-certificate";

export const metadata: Metadata = { title: "Batch" };

export default async function BatchPage({ params }: { params: Promise<{ id: string; number: string }> }) {
  const { id, number } = await params;
  const user = await requireRole("waves.read", `/waves/${id}/batches/${number}`);
  const waveId = pageId(id);
  const n = pageId(number);
  const wave = await getWave(user.siteId, waveId);
  const batch = wave ? await getBatch(wave.id, n) : null;
  if (!wave || !batch) notFound();
  const v = await getLayoutVersionById(user.siteId, wave.layoutVersionId);
  const version = v ? await getLayoutVersion(user.siteId, v.floorPlanId, v.number) : null;
  if (!version) notFound();
  const [{ graph, matrix }, site] = await Promise.all([layoutGraph(wave.layoutVersionId), getSite(user.siteId)]);
  const { cells, legsMm } = batchRouteCells(
    graph,
    matrix,
    wave.settings.depotId,
    wave.settings.dropoffId,
    batch.stops.map((s) => s.accessPoint),
  );
  const seconds = estimateSeconds({ distanceMm: batch.distanceMm, lines: batch.lineCount }, siteTiming(site));
  return (
    <>
      <p className="mb-2 text-sm">
        <Link className="underline" href="/waves">
          Waves
        </Link>{" "}
        ›{" "}
        <Link className="underline" href={`/waves/${wave.id}`}>
          {wave.name}
        </Link>{" "}
        › batch {batch.number}
      </p>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1>Batch {batch.number}</h1>
        <Link className="btn-quiet" href={`/waves/${wave.id}/batches/${batch.number}/print`}>
          Pick list
        </Link>
      </div>
      <p className="mt-1 text-ink-soft">
        {batch.stops.length} stops, {batch.lineCount} lines in {batch.toteCount} totes, {kilograms(batch.weightG)}. Walk{" "}
        {metres(batch.distanceMm)} against {metres(batch.baselineMm)} in the usual order:{" "}
        {savingsPct(batch.distanceMm, batch.baselineMm)} less. About {minutes(seconds)},{" "}
        {timingNote(siteTiming(site), site?.units)}.
      </p>
      <p className="mt-1 mb-4" data-testid="route-certificate">
        <span className="font-semibold">Route:</span> {routeCertificateLine(batch)}.
      </p>
      <BatchLiveStatus waveId={wave.id} number={batch.number} live={wave.status === "released"} />
      <BatchRoute
        document={version.document}
        cells={cells}
        stops={batch.stops}
        legsMm={legsMm}
        from={wave.settings.depotId}
        to={wave.settings.dropoffId}
      />
    </>
  );
}

import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { requireRole } from "@/lib/auth/guard";
import { pageId } from "@/lib/http/page-params";
import { roleMay } from "@/lib/auth/permissions";
import { getWave } from "@/db/waves";
import { listBatches } from "@/db/batches";
import { shortPicksOfWave } from "@/db/short-picks";
import { getSite } from "@/db/sites";
import { WaveLive } from "@/components/waves/WaveLive";
import { WaveActions } from "@/components/waves/WaveActions";
import { SavingsChart } from "@/components/waves/SavingsChart";
import { UnbatchedOrders } from "@/components/waves/UnbatchedOrders";
import { PlanComparison } from "@/components/waves/PlanComparison";
import { estimateSeconds, siteTiming } from "@/lib/batching/estimate";
import { metres, minutes, savingsPct } from "@/lib/format/units";

export const metadata: Metadata = { title: "Wave" };

export default async function WavePage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requireRole("waves.read", `/waves/${id}`);
  const wave = await getWave(user.siteId, pageId(id));
  if (!wave) notFound();
  const [batches, site, shortPicks] = await Promise.all([
    listBatches(wave.id),
    getSite(user.siteId),
    shortPicksOfWave(wave.id),
  ]);
  const timing = siteTiming(site);
  const rows = batches.map((b) => ({
    ...b,
    seconds: estimateSeconds({ distanceMm: b.distanceMm, lines: b.lineCount }, timing),
  }));
  const totalSeconds = rows.reduce((a, b) => a + b.seconds, 0);
  const s = wave.settings;
  return (
    <>
      <p className="mb-2 text-sm">
        <Link className="underline" href="/waves">
          Waves
        </Link>{" "}
        › {wave.name}
      </p>
      <h1>{wave.name}</h1>
      <p className="mt-1 text-ink-soft">
        {wave.orderCount} orders
        {wave.status === "released" && wave.unbatchable.length > 0
          ? ` (and ${wave.unbatchable.length} handed back to open)`
          : ""}{" "}
        on {wave.floorPlanName}, layout version {wave.layoutVersionNumber}. Carts of {s.totesPerCart} totes, at most{" "}
        {s.maxLines} lines and {s.maxWeightG / 1000} kg; from {s.depotId} to {s.dropoffId};{" "}
        {s.method === "savings" ? "batched by route savings" : "batched first come by cut-off"}.
      </p>
      <WaveActions
        waveId={wave.id}
        status={wave.status}
        version={wave.version}
        canPlan={roleMay(user.role, "waves.plan")}
        batchCount={batches.length}
        unbatchedCount={wave.unbatchable.length}
        orderCount={wave.orderCount}
      />
      <UnbatchedOrders wave={wave} />
      {batches.length > 0 && wave.distanceMm !== null && wave.baselineMm !== null && (
        <section className="mt-6 grid gap-4 md:grid-cols-[1fr_2fr]" aria-label="Wave summary">
          <dl className="card grid grid-cols-2 gap-3">
            <dt className="text-ink-soft">Batches</dt>
            <dd className="text-xl font-bold">{batches.length}</dd>
            <dt className="text-ink-soft">Planned walk</dt>
            <dd className="text-xl font-bold">{metres(wave.distanceMm)}</dd>
            <dt className="text-ink-soft">Usual walk</dt>
            <dd className="text-xl">{metres(wave.baselineMm)}</dd>
            <dt className="text-ink-soft">Savings</dt>
            <dd className="text-xl font-bold text-trail-dark">{savingsPct(wave.distanceMm, wave.baselineMm)}</dd>
            <dt className="text-ink-soft">Estimated time</dt>
            <dd className="text-xl">{minutes(totalSeconds)}</dd>
            <dd className="col-span-2 text-sm text-ink-soft">
              Estimates assume {timing.walkingSpeedMmPerS / 1000} m/s walking and {timing.secondsPerLine} s per line
              (common practice; set your site&apos;s own figures).
            </dd>
          </dl>
          <SavingsChart batches={batches} />
        </section>
      )}
      <PlanComparison waveId={wave.id} status={wave.status} canPlan={roleMay(user.role, "waves.plan")} settings={s} />
      <section className="mt-6" aria-labelledby="batches-title">
        <div className="mb-3 flex flex-wrap items-center justify-between gap-3">
          <h2 id="batches-title">Batches</h2>
          {batches.length > 0 && (
            <Link className="btn-quiet" href={`/waves/${wave.id}/print`}>
              Pick lists of all batches
            </Link>
          )}
        </div>
        <WaveLive initial={{ wave, batches, shortPicks }} timing={timing} />
      </section>
    </>
  );
}

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
import { estimateSeconds, siteTiming, timingNote } from "@/lib/batching/estimate";
import { distance, minutes, savingsPct } from "@/lib/format/units";
import { WaveFinish } from "@/components/waves/WaveFinish";
import { activePickerCount, earliestCutoffOfWave } from "@/db/wave-timing";
import { RecallBatches } from "@/components/waves/RecallBatches";
import { recallableBatches } from "@/db/wave-control";
import { waveEnds } from "@/lib/waves/wave-control";
import { PlanComparison } from "@/components/waves/PlanComparison";

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
  const canPlan = roleMay(user.role, "waves.plan");
  const [ends, recallable] = await Promise.all([
    canPlan && wave.status !== "released" ? waveEnds(user, wave) : null,
    canPlan && wave.status === "released" ? recallableBatches(wave.id) : [],
  ]);
  const timing = siteTiming(site);
  const units = site?.units ?? "metric";
  const [earliestCutoff, pickersOnShift] = await Promise.all([
    earliestCutoffOfWave(wave.id),
    activePickerCount(user.siteId),
  ]);
  // Recalled batches stay in the table as history; the summary counts only the batches still to pick.
  const working = batches.filter((b) => b.status !== "recalled");
  const rows = working.map((b) => ({
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
        canPlan={canPlan}
        batchCount={batches.length}
        unbatchedCount={wave.unbatchable.length}
        orderCount={wave.orderCount}
        editor={ends ? { name: wave.name, settings: wave.settings, ends } : undefined}
      />
      {canPlan && <RecallBatches waveId={wave.id} batches={recallable} />}
      <UnbatchedOrders wave={wave} />
      {working.length > 0 && wave.distanceMm !== null && wave.baselineMm !== null && (
        <section className="mt-6 grid gap-4 md:grid-cols-[1fr_2fr]" aria-label="Wave summary">
          <dl className="card grid grid-cols-2 gap-3">
            <dt className="text-ink-soft">Batches</dt>
            <dd className="text-xl font-bold">{working.length}</dd>
            <dt className="text-ink-soft">Planned walk</dt>
            <dd className="text-xl font-bold">{distance(wave.distanceMm, units)}</dd>
            <dt className="text-ink-soft">Usual walk</dt>
            <dd className="text-xl">{distance(wave.baselineMm, units)}</dd>
            <dt className="text-ink-soft">Savings</dt>
            <dd className="text-xl font-bold text-trail-dark">{savingsPct(wave.distanceMm, wave.baselineMm)}</dd>
            <dt className="text-ink-soft">Estimated time</dt>
            <dd className="text-xl">{minutes(totalSeconds)}</dd>
            <dd className="col-span-2 text-sm text-ink-soft">Estimated {timingNote(timing, units)}.</dd>
          </dl>
          <SavingsChart batches={working} />
        </section>
      )}
      <WaveFinish
        wave={wave}
        batches={working}
        timing={timing}
        units={units}
        earliestCutoff={earliestCutoff}
        pickersOnShift={pickersOnShift}
        nowIso={new Date().toISOString()}
      />
      <PlanComparison waveId={wave.id} status={wave.status} canPlan={canPlan} settings={s} />
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

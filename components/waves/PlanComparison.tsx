"use client";

import { useState } from "react";
import useSWR from "swr";
import { postJson, swrFetcher, type ApiFailure } from "@/lib/client/fetch-json";
import { JobProgress } from "@/components/JobProgress";
import { FieldErrors } from "@/components/FieldErrors";
import { useDateStyle } from "@/components/SiteFormat";
import { formatWhen } from "@/lib/format/dates";
import { kilograms, metres, minutes, savingsPct } from "@/lib/format/units";
import type { WaveSettings, WaveStatus } from "@/lib/contracts/waves";
import { MAX_PLAN_VARIANTS, type PlanVariant, type WavePlanDTO, type WavePlansDTO } from "@/lib/contracts/wave-plans";
import { PlanComparisonChart } from "./PlanComparisonChart";

type Props = { waveId: number; status: WaveStatus; canPlan: boolean; settings: WaveSettings };

type Row = { method: PlanVariant["method"]; totesPerCart: string; maxLines: string; maxWeightKg: string };

const methodWords = (m: PlanVariant["method"]) => (m === "savings" ? "Route savings" : "First come by cut-off");

function startRows(s: WaveSettings): Row[] {
  const limits = {
    totesPerCart: String(s.totesPerCart),
    maxLines: String(s.maxLines),
    maxWeightKg: String(s.maxWeightG / 1000),
  };
  return [
    { method: "first-come", ...limits },
    { method: "savings", ...limits },
  ];
}

const toVariant = (r: Row): PlanVariant => ({
  method: r.method,
  totesPerCart: Number(r.totesPerCart),
  maxLines: Number(r.maxLines),
  maxWeightG: Math.round(Number(r.maxWeightKg) * 1000),
});

/** Savings as a sentence that names its baseline, so no percentage stands without what it is against. */
function against(planMm: number, baselineMm: number, baseline: string): string {
  if (!(baselineMm > 0)) return `— (no ${baseline} to compare)`;
  const pct = savingsPct(planMm, baselineMm);
  return planMm <= baselineMm
    ? `${pct} less than ${baseline}`
    : `${savingsPct(baselineMm, planMm)} more than ${baseline}`;
}

/** The planner plans the same wave several ways and keeps one: each plan beside the others and both baselines. */
export function PlanComparison({ waveId, status, canPlan, settings }: Props) {
  const url = `/api/waves/${waveId}/plans`;
  const { data, error, mutate } = useSWR<WavePlansDTO>(url, swrFetcher);
  const [rows, setRows] = useState<Row[]>(() => startRows(settings));
  const [jobId, setJobId] = useState<string | null>(null);
  const [failure, setFailure] = useState<ApiFailure | null>(null);
  const [busy, setBusy] = useState(false);
  const [asking, setAsking] = useState<WavePlanDTO | null>(null);

  if (status === "released" && !data?.plans.length) return null;

  const setRow = (i: number, change: Partial<Row>) =>
    setRows((rs) => rs.map((r, j) => (j === i ? { ...r, ...change } : r)));

  async function compare(e: React.FormEvent) {
    e.preventDefault();
    if (!data) return;
    setBusy(true);
    setFailure(null);
    const r = await postJson<{ jobId: string }>(url, { version: data.wave.version, variants: rows.map(toVariant) });
    setBusy(false);
    if (r.ok) setJobId(r.data.jobId);
    else setFailure(r);
  }

  async function keep(plan: WavePlanDTO) {
    if (!data) return;
    setAsking(null);
    setBusy(true);
    setFailure(null);
    const r = await postJson(`${url}/${plan.id}/keep`, { version: data.wave.version });
    if (r.ok) return window.location.reload();
    setBusy(false);
    setFailure(r);
    void mutate();
  }

  const current = data?.plans.filter((p) => p.current) ?? [];
  const earlier = data?.plans.filter((p) => !p.current) ?? [];
  const mayCompare = canPlan && status !== "released" && data !== undefined;

  return (
    <section className="mt-6 space-y-4" aria-labelledby="plans-title">
      <h2 id="plans-title">Plans compared</h2>
      <p className="text-ink-soft">
        Plan this wave several ways on the same orders and keep the one that suits the shift. Each plan is set against
        two baselines: <strong>order by order</strong> (one order per trip from the depot to the drop-off, each on its
        shortest route: picking with no batching) and <strong>the usual walk</strong> (the same batches walked in the
        site&apos;s usual bin order).
      </p>
      {error && (
        <p role="alert" className="notice-error">
          Could not load the plans: {(error as Error).message}
        </p>
      )}
      {mayCompare && !jobId && (
        <form className="card space-y-4" onSubmit={compare} noValidate aria-label="Plans to compare">
          <p className="font-semibold">
            Plans to compare (2 to {MAX_PLAN_VARIANTS}); every plan starts at {settings.depotId} and ends at{" "}
            {settings.dropoffId}, like the wave.
          </p>
          {rows.map((r, i) => (
            <fieldset key={i} className="grid grid-cols-2 gap-3 border-t border-rack-light pt-3 sm:grid-cols-5">
              <legend className="label">Plan {i + 1}</legend>
              <label className="col-span-2 sm:col-span-1">
                <span className="label text-sm">Batching</span>
                <select
                  className="field"
                  value={r.method}
                  onChange={(e) => setRow(i, { method: e.target.value as PlanVariant["method"] })}
                >
                  <option value="first-come">First come by cut-off</option>
                  <option value="savings">Route savings</option>
                </select>
              </label>
              <label>
                <span className="label text-sm">Totes per cart</span>
                <input
                  className="field"
                  type="number"
                  min={1}
                  max={40}
                  value={r.totesPerCart}
                  onChange={(e) => setRow(i, { totesPerCart: e.target.value })}
                />
              </label>
              <label>
                <span className="label text-sm">Most lines</span>
                <input
                  className="field"
                  type="number"
                  min={1}
                  max={500}
                  value={r.maxLines}
                  onChange={(e) => setRow(i, { maxLines: e.target.value })}
                />
              </label>
              <label>
                <span className="label text-sm">Most weight (kg)</span>
                <input
                  className="field"
                  type="number"
                  min={1}
                  step="0.5"
                  value={r.maxWeightKg}
                  onChange={(e) => setRow(i, { maxWeightKg: e.target.value })}
                />
              </label>
              <div className="flex items-end">
                {rows.length > 2 && (
                  <button
                    type="button"
                    className="btn-quiet w-full"
                    onClick={() => setRows((rs) => rs.filter((_, j) => j !== i))}
                  >
                    Remove plan {i + 1}
                  </button>
                )}
              </div>
            </fieldset>
          ))}
          <p className="text-sm text-ink-soft">
            Heavier carts are harder to push and stop: keep the weight within what your carts and pickers are rated for.
          </p>
          <div className="flex flex-wrap gap-2">
            <button className="btn-primary" disabled={busy}>
              Compare these plans
            </button>
            {rows.length < MAX_PLAN_VARIANTS && (
              <button
                type="button"
                className="btn-quiet"
                onClick={() => setRows((rs) => [...rs, { ...(rs[rs.length - 1] as Row) }])}
              >
                Add a plan
              </button>
            )}
          </div>
        </form>
      )}
      {jobId && (
        <div className="card space-y-3">
          <JobProgress
            jobId={jobId}
            what="Comparing plans"
            cancellable
            onFinished={() => void mutate()}
            done={(_r, message) => <>{message}.</>}
          />
          <button type="button" className="btn-quiet" onClick={() => setJobId(null)}>
            Compare other plans
          </button>
        </div>
      )}
      {failure && (
        <div role="alert" className="notice-error">
          {failure.message}
          <FieldErrors issues={failure.issues} />
        </div>
      )}
      {asking && (
        <div className="notice-info space-y-3" role="alertdialog" aria-labelledby="keep-question">
          <p id="keep-question">
            Keep “{asking.label}” as the wave&apos;s plan? The wave&apos;s batches become its {asking.summary.batches}{" "}
            {asking.summary.batches === 1 ? "batch" : "batches"} and its cart settings become this plan&apos;s
            {status === "planned" ? "; pick lists printed for the batches it has now no longer count" : ""}.
          </p>
          <div className="flex flex-wrap gap-2">
            <button type="button" className="btn-primary" onClick={() => keep(asking)} disabled={busy}>
              Yes, keep this plan
            </button>
            <button type="button" className="btn-quiet" onClick={() => setAsking(null)}>
              Not yet
            </button>
          </div>
        </div>
      )}
      {current.length > 0 && (
        <>
          <PlanTable plans={current} canKeep={canPlan && status !== "released"} busy={busy} onKeep={setAsking} />
          <PlanComparisonChart plans={current} />
        </>
      )}
      {data && current.length === 0 && earlier.length === 0 && (
        <p className="text-ink-soft">No plans compared for this wave yet.</p>
      )}
      {earlier.length > 0 && (
        <details className="card">
          <summary className="cursor-pointer font-semibold">
            {earlier.length} earlier {earlier.length === 1 ? "plan" : "plans"}, out of date
          </summary>
          <p className="my-2 text-sm text-ink-soft">
            Computed before the wave last changed (its orders or settings, a new plan, or its release), so they cannot
            be kept. Compare again for plans of the wave as it stands.
          </p>
          <PlanTable plans={earlier} canKeep={false} busy={busy} onKeep={setAsking} outOfDate />
        </details>
      )}
    </section>
  );
}

function PlanTable({
  plans,
  canKeep,
  busy,
  onKeep,
  outOfDate = false,
}: {
  plans: WavePlanDTO[];
  canKeep: boolean;
  busy: boolean;
  onKeep: (p: WavePlanDTO) => void;
  outOfDate?: boolean;
}) {
  const style = useDateStyle();
  const timing = plans[0]?.summary.timing;
  const rows: { head: string; cell: (p: WavePlanDTO) => React.ReactNode }[] = [
    { head: "Batching", cell: (p) => methodWords(p.settings.method) },
    {
      head: "Cart limits",
      cell: (p) =>
        `${p.settings.totesPerCart} totes, ${p.settings.maxLines} lines, ${kilograms(p.settings.maxWeightG)}`,
    },
    { head: "Batches (cart trips)", cell: (p) => p.summary.batches },
    { head: "Totes filled", cell: (p) => `${p.summary.totes} of ${p.summary.batches * p.settings.totesPerCart}` },
    { head: "Orders / lines batched", cell: (p) => `${p.summary.orders} / ${p.summary.lines}` },
    { head: "Orders left out", cell: (p) => p.summary.unbatchedOrders },
    { head: "Total walk", cell: (p) => <strong>{metres(p.summary.distanceMm)}</strong> },
    { head: "Estimated time", cell: (p) => <strong>{minutes(p.summary.estimatedSeconds)}</strong> },
    {
      head: "Against order by order",
      cell: (p) => against(p.summary.distanceMm, p.summary.orderByOrderMm, "order by order"),
    },
    {
      head: "Against the usual walk",
      cell: (p) => against(p.summary.distanceMm, p.summary.usualWalkMm, "the usual walk"),
    },
    {
      head: "Baseline: order by order",
      cell: (p) =>
        `${metres(p.summary.orderByOrderMm)}, ${minutes(p.summary.orderByOrderSeconds)}${p.summary.orderByOrderOptimal ? "" : " (some trips not proved shortest)"}`,
    },
    { head: "Baseline: usual walk", cell: (p) => metres(p.summary.usualWalkMm) },
    { head: "Computed", cell: (p) => `${formatWhen(p.createdAt, style)}${p.createdBy ? ` by ${p.createdBy}` : ""}` },
  ];
  return (
    <div className="card overflow-x-auto">
      <table
        className="w-full min-w-[28rem] border-collapse text-left text-sm"
        aria-label={outOfDate ? "Earlier plans" : "Plans side by side"}
      >
        <thead>
          <tr className="border-b-2 border-rack-light">
            <th scope="col" className="py-2 pr-3">
              Plan
            </th>
            {plans.map((p, i) => (
              <th key={p.id} scope="col" className="py-2 pr-3 align-bottom">
                Plan {i + 1}
                {p.kept && (
                  <span className="ml-2 rounded bg-trail-light px-2 text-trail-dark">✓ the wave&apos;s plan</span>
                )}
                {outOfDate && <span className="ml-2 rounded bg-signal-light px-2 text-signal">out of date</span>}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.head} className="border-b border-rack-light">
              <th scope="row" className="py-2 pr-3 font-semibold text-ink-soft">
                {r.head}
              </th>
              {plans.map((p) => (
                <td key={p.id} className="py-2 pr-3">
                  {r.cell(p)}
                </td>
              ))}
            </tr>
          ))}
          {canKeep && (
            <tr>
              <th scope="row" className="py-2 pr-3" />
              {plans.map((p, i) => (
                <td key={p.id} className="py-2 pr-3">
                  {p.kept ? (
                    <span className="text-trail-dark">Kept</span>
                  ) : (
                    <button type="button" className="btn-quiet" disabled={busy} onClick={() => onKeep(p)}>
                      Keep plan {i + 1}
                    </button>
                  )}
                </td>
              ))}
            </tr>
          )}
        </tbody>
      </table>
      {timing && (
        <p className="mt-2 text-sm text-ink-soft">
          Estimated times assume {timing.walkingSpeedMmPerS / 1000} m/s walking, {timing.secondsPerLine} s per line and{" "}
          {timing.setupSecondsPerBatch} s set-up per cart, the site&apos;s figures when the plans were computed; order
          by order counts each order as its own trip, with its own set-up.
        </p>
      )}
    </div>
  );
}

"use client";

import useSWR from "swr";
import { useEffect, useState } from "react";
import { swrFetcher } from "@/lib/client/fetch-json";
import type { BatchSummaryDTO } from "@/lib/contracts/batches";
import type { WaveDTO } from "@/lib/contracts/waves";
import type { Units } from "@/lib/contracts/site";
import { estimateSeconds, timingNote, type SiteTiming } from "@/lib/batching/estimate";
import { shiftFinish } from "@/lib/batching/shift-finish";
import { formatDateTime, formatWhen } from "@/lib/format/dates";
import { minutes } from "@/lib/format/units";
import { useDateStyle } from "@/components/SiteFormat";

const MAX_PICKERS = 200;

/** What is left of each unfinished batch: its estimate times the share of its lines still open. */
function secondsLeft(batches: BatchSummaryDTO[], timing: SiteTiming): number[] {
  const out: number[] = [];
  for (const b of batches) {
    const done = b.pickedLines + b.shortLines;
    // A recalled batch is history: nobody will pick it.
    if (b.status === "done" || b.status === "recalled" || done >= b.lineCount) continue;
    const full = estimateSeconds({ distanceMm: b.distanceMm, lines: b.lineCount }, timing);
    out.push(b.lineCount > 0 ? (full * (b.lineCount - done)) / b.lineCount : full);
  }
  return out;
}

/**
 * The wave's estimated finish for the pickers on shift, and how many it takes to make its earliest
 * cut-off. Shares the wave page's live answer (same SWR key), so it follows the picking.
 */
export function WaveFinish({
  wave,
  batches: initialBatches,
  timing,
  units,
  earliestCutoff,
  pickersOnShift,
  nowIso,
}: {
  wave: WaveDTO;
  batches: BatchSummaryDTO[];
  timing: SiteTiming;
  units: Units;
  earliestCutoff: string | null;
  pickersOnShift: number;
  nowIso: string;
}) {
  const style = useDateStyle();
  const { data } = useSWR<{ batches: BatchSummaryDTO[] }>(`/api/waves/${wave.id}`, swrFetcher, {
    refreshInterval: wave.status === "released" ? 5000 : 0,
    revalidateOnMount: false,
  });
  const batches = data?.batches ?? initialBatches;
  const [typed, setTyped] = useState(String(Math.max(1, pickersOnShift)));
  const [now, setNow] = useState(() => Date.parse(nowIso));
  useEffect(() => {
    const t = setInterval(() => setNow(Date.now()), 30_000);
    return () => clearInterval(t);
  }, []);

  if (batches.length === 0) return null;
  const left = secondsLeft(batches, timing);
  const p = Number(typed);
  const pickersOk = Number.isInteger(p) && p >= 1 && p <= MAX_PICKERS;
  const cutoffMs = earliestCutoff ? Date.parse(earliestCutoff) : null;
  const f = pickersOk ? shiftFinish(left, p, now, cutoffMs) : null;

  return (
    <section className="card mt-6 space-y-3" aria-labelledby="finish-title">
      <h2 id="finish-title">Estimated finish</h2>
      {left.length === 0 ? (
        <p>Every batch of this wave is picked.</p>
      ) : (
        <>
          <label className="block max-w-xs">
            <span className="label">Pickers on shift</span>
            <input
              className="field"
              type="number"
              inputMode="numeric"
              min={1}
              max={MAX_PICKERS}
              step={1}
              value={typed}
              onChange={(e) => setTyped(e.target.value)}
              aria-describedby="pickers-hint"
            />
            <span id="pickers-hint" className="mt-1 block text-sm text-ink-soft">
              {pickersOnShift} active picker account{pickersOnShift === 1 ? "" : "s"} at this site; type how many are on
              shift.
            </span>
          </label>
          {!f ? (
            <p role="alert" className="notice-error">
              Enter a whole number of pickers from 1 to {MAX_PICKERS}.
            </p>
          ) : (
            <div role="status" aria-live="polite" className="space-y-2" data-testid="wave-finish">
              <p>
                {left.length} batch{left.length === 1 ? "" : "es"} left ({minutes(left.reduce((a, b) => a + b, 0))} of
                work). With <span className="font-semibold">{p}</span> picker{p === 1 ? "" : "s"} starting now, the last
                one is done at about{" "}
                <span className="text-xl font-bold">{formatWhen(f.finishMs, style, new Date(now))}</span> (in{" "}
                {minutes(f.makespanSeconds)}).
              </p>
              {f.cutoffMs !== null && (
                <p className={f.meetsCutoff ? "notice-info" : "notice-error"}>
                  Earliest cut-off: <span className="font-semibold">{formatDateTime(f.cutoffMs, style)}</span>.{" "}
                  {f.cutoffMs <= now
                    ? "It has already passed: these orders are late whatever happens now."
                    : f.meetsCutoff
                      ? `${p === 1 ? "1 picker makes" : `${p} pickers make`} it`
                      : `${p === 1 ? "1 picker misses" : `${p} pickers miss`} it by ${minutes((f.finishMs - f.cutoffMs) / 1000)}`}
                  {f.cutoffMs > now && f.needed?.kind === "met" && (
                    <>
                      ; it needs at least <span className="font-semibold">{f.needed.pickers}</span> picker
                      {f.needed.pickers === 1 ? "" : "s"}.
                    </>
                  )}
                  {f.cutoffMs > now && f.needed?.kind === "cannot" && (
                    <>
                      ; it cannot be met by adding pickers: the longest batch alone takes{" "}
                      {minutes(f.needed.longestSeconds)}. Split the wave or move the cut-off.
                    </>
                  )}
                </p>
              )}
              {f.cutoffMs === null && <p className="text-ink-soft">None of these orders has a cut-off.</p>}
            </div>
          )}
          <p className="text-sm text-ink-soft">
            Each batch {timingNote(timing, units)}; a batch being picked counts by its share of lines left. Batches go
            longest first to the picker with the least work so far (LPT), as a supervisor handing out carts would.
          </p>
        </>
      )}
    </section>
  );
}

"use client";

import Link from "next/link";
import useSWR from "swr";
import { useState } from "react";
import { EmptyState } from "@/components/EmptyState";
import { FailureNotice } from "@/components/FailureNotice";
import { useDateStyle } from "@/components/SiteFormat";
import { postJson, swrFetcher, type ApiFailure } from "@/lib/client/fetch-json";
import { formatDate, formatWhen } from "@/lib/format/dates";
import type { FollowUpAction, ReplenishmentDTO, ShortPickRowDTO, ShortPicksDTO } from "@/lib/contracts/short-picks";

function outcomeText(s: ShortPickRowDTO): string | null {
  if (s.followUp === "repick") return `Re-picked later${s.followUpByName ? ` (chosen by ${s.followUpByName})` : ""}`;
  if (s.followUp === "cancel") return `Rest cancelled${s.followUpByName ? ` by ${s.followUpByName}` : ""}`;
  return null;
}

function ShortPickCard({ s, onChanged }: { s: ShortPickRowDTO; onChanged: () => void }) {
  const style = useDateStyle();
  const [busy, setBusy] = useState<FollowUpAction | null>(null);
  const [failure, setFailure] = useState<ApiFailure | null>(null);
  const [confirmCancel, setConfirmCancel] = useState(false);
  async function send(action: FollowUpAction) {
    if (busy) return;
    setBusy(action);
    setFailure(null);
    const r = await postJson(`/api/short-picks/${s.lineId}/follow-up`, { action, version: s.version });
    setBusy(null);
    setConfirmCancel(false);
    if (!r.ok) setFailure(r);
    onChanged();
  }
  const outcome = outcomeText(s);
  return (
    <li
      className="card space-y-3"
      data-testid="short-pick"
      aria-label={`Short pick of order ${s.orderNumber}, ${s.sku}`}
    >
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <p className="text-lg">
          <Link className="font-semibold underline" href={`/orders/${s.orderId}`}>
            {s.orderNumber}
          </Link>{" "}
          · {s.sku} · bin <span className="font-semibold">{s.binCode}</span>
        </p>
        <p className="text-sm text-ink-soft">
          {s.at ? formatWhen(s.at, style) : ""} · {s.pickerName ?? "unknown picker"}
        </p>
      </div>
      <p>
        <span className="font-semibold text-alarm">{s.short} short</span> (picked {s.picked} of {s.ordered})
        {s.reason ? `: ${s.reason}` : ""} · batch{" "}
        <Link className="underline" href={`/waves/${s.waveId}/batches/${s.batchNumber}`}>
          #{s.batchNumber}
        </Link>{" "}
        of{" "}
        <Link className="underline" href={`/waves/${s.waveId}`}>
          {s.waveName}
        </Link>
      </p>
      <div data-testid="follow-up" className="space-y-1">
        {outcome ? (
          <p className="font-semibold text-trail-dark">
            ✓ {outcome}
            {s.followUpAt ? `, ${formatWhen(s.followUpAt, style)}` : ""}
            {s.repickOrder && (
              <>
                {" "}
                on order{" "}
                <Link className="underline" href={`/orders/${s.repickOrder.id}`}>
                  {s.repickOrder.orderNumber}
                </Link>
              </>
            )}
          </p>
        ) : (
          <p className="font-semibold">Follow-up needed: what happens to the {s.short} not picked?</p>
        )}
        {s.replenishAt && (
          <p className="text-sm">⚑ Bin flagged for replenishment, {formatWhen(s.replenishAt, style)}</p>
        )}
      </div>
      <div className="flex flex-wrap gap-2">
        {!s.followUp && (
          <button type="button" className="btn-primary" disabled={busy !== null} onClick={() => send("repick")}>
            {busy === "repick" ? "Saving…" : "Re-pick later"}
          </button>
        )}
        {!s.followUp &&
          (confirmCancel ? (
            <button type="button" className="btn-danger" disabled={busy !== null} onClick={() => send("cancel")}>
              {busy === "cancel" ? "Saving…" : `Yes, cancel the ${s.short} not picked`}
            </button>
          ) : (
            <button type="button" className="btn-quiet" disabled={busy !== null} onClick={() => setConfirmCancel(true)}>
              Cancel the rest of the line
            </button>
          ))}
        {!s.replenishAt && (
          <button type="button" className="btn-quiet" disabled={busy !== null} onClick={() => send("replenish")}>
            {busy === "replenish" ? "Saving…" : "Flag the bin for replenishment"}
          </button>
        )}
      </div>
      {confirmCancel && (
        <p className="text-sm">
          Nothing more will be picked for this line; the order can then be completed short.{" "}
          <button type="button" className="underline" onClick={() => setConfirmCancel(false)}>
            Keep the line
          </button>
        </p>
      )}
      <FailureNotice failure={failure} />
    </li>
  );
}

function Replenishments({ list, onChanged }: { list: ReplenishmentDTO[]; onChanged: () => void }) {
  const style = useDateStyle();
  const [failure, setFailure] = useState<ApiFailure | null>(null);
  const [busy, setBusy] = useState<number | null>(null);
  async function clear(r: ReplenishmentDTO) {
    if (busy !== null) return;
    setBusy(r.id);
    setFailure(null);
    const res = await postJson(`/api/replenishments/${r.id}/clear`, { version: r.version });
    setBusy(null);
    if (!res.ok) setFailure(res);
    onChanged();
  }
  return (
    <section aria-labelledby="replenish-heading" className="space-y-3">
      <h2 id="replenish-heading">Bins to replenish ({list.length})</h2>
      <p className="text-sm text-ink-soft">
        Refilling high bins needs a step or ladder; lift heavy cartons at waist height or with two people, and follow
        your site&apos;s rules in forklift aisles.
      </p>
      <FailureNotice failure={failure} />
      {list.length === 0 ? (
        <p className="text-ink-soft">No bin is flagged for replenishment.</p>
      ) : (
        <ul className="grid gap-2 sm:grid-cols-2">
          {list.map((r) => (
            <li
              key={r.id}
              className="card flex flex-wrap items-center justify-between gap-2"
              data-testid="replenishment"
            >
              <span>
                <span className="font-semibold">⚑ {r.binCode}</span>
                {r.sku ? ` · ${r.sku}` : ""}
                <span className="block text-sm text-ink-soft">
                  Flagged {formatWhen(r.requestedAt, style)}
                  {r.requestedByName ? ` by ${r.requestedByName}` : ""}
                </span>
              </span>
              <button type="button" className="btn-quiet" disabled={busy !== null} onClick={() => clear(r)}>
                {busy === r.id ? "Clearing…" : "Done: bin refilled"}
              </button>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

/** One shift's short picks (a day in the site's time zone), their follow-ups, and the bins flagged for replenishment. */
export function ShortPicksScreen({ today }: { today: string }) {
  const style = useDateStyle();
  const [date, setDate] = useState(today);
  const [waveId, setWaveId] = useState("");
  const query = new URLSearchParams({ date: date || today, ...(waveId ? { waveId } : {}) }).toString();
  const { data, error, mutate } = useSWR<ShortPicksDTO>(`/api/short-picks?${query}`, swrFetcher, {
    keepPreviousData: true,
  });
  const list = data?.shortPicks ?? [];
  const open = list.filter((s) => !s.followUp).length;
  const dayLabel = formatDate(new Date(`${date || today}T12:00:00Z`), { ...style, timeZone: "UTC" });
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-end gap-4">
        <label className="block">
          <span className="label">Shift of</span>
          <input
            type="date"
            className="field"
            value={date}
            max={today}
            onChange={(e) => {
              setDate(e.target.value);
              setWaveId("");
            }}
          />
        </label>
        <label className="block min-w-60">
          <span className="label">Wave</span>
          <select className="field" value={waveId} onChange={(e) => setWaveId(e.target.value)}>
            <option value="">Every wave</option>
            {(data?.waves ?? []).map((w) => (
              <option key={w.id} value={String(w.id)}>
                {w.name}
              </option>
            ))}
          </select>
        </label>
        {date !== today && (
          <button type="button" className="btn-quiet" onClick={() => setDate(today)}>
            Today
          </button>
        )}
      </div>
      {error && (
        <p role="alert" className="notice-error">
          {(error as Error).message}
        </p>
      )}
      {data && (
        <p role="status" data-testid="short-picks-count">
          {list.length === 0
            ? `No short picks on ${dayLabel}${waveId ? " in this wave" : ""}.`
            : `${list.length} short ${list.length === 1 ? "pick" : "picks"} on ${dayLabel}, ${open} still to follow up. Times in ${style.timeZone} time.`}
        </p>
      )}
      {data && list.length === 0 ? (
        <EmptyState title="Nothing to follow up">
          Short picks appear here as pickers report them on their handhelds. Choose another day to see an earlier shift.
        </EmptyState>
      ) : (
        <ul className="space-y-3">
          {list.map((s) => (
            <ShortPickCard key={s.lineId} s={s} onChanged={() => void mutate()} />
          ))}
        </ul>
      )}
      {data && <Replenishments list={data.replenishments} onChanged={() => void mutate()} />}
    </div>
  );
}

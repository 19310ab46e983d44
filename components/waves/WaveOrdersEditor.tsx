"use client";

import { useState } from "react";
import useSWR from "swr";
import { postJson, swrFetcher, type ApiFailure } from "@/lib/client/fetch-json";
import { FailureNotice } from "@/components/FailureNotice";
import { useDateStyle } from "@/components/SiteFormat";
import { formatDateTime } from "@/lib/format/dates";
import type { WaveOrderRowDTO, WaveOrdersDTO } from "@/lib/contracts/wave-control";

/** A datetime-local value (the planner's local time) as an ISO instant, or undefined when empty or unfinished. */
function isoOf(local: string): string | undefined {
  if (!local) return undefined;
  const d = new Date(local);
  return Number.isNaN(d.getTime()) ? undefined : d.toISOString();
}

function OrderTable({
  label,
  rows,
  ticked,
  onTick,
}: {
  label: string;
  rows: WaveOrderRowDTO[];
  ticked: Set<number>;
  onTick: (id: number, on: boolean) => void;
}) {
  const style = useDateStyle();
  return (
    <div className="max-h-80 overflow-auto rounded-md border border-rack-light">
      <table className="w-full text-sm" aria-label={label}>
        <thead className="sticky top-0 bg-paper-sunk text-left">
          <tr>
            <th className="p-2">
              <span className="sr-only">Tick</span>
            </th>
            <th className="p-2">Order</th>
            <th className="p-2">Cut-off</th>
            <th className="p-2">Priority</th>
            <th className="p-2">Lines</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((o) => (
            <tr key={o.id} className="border-t border-rack-light">
              <td className="p-2">
                <input
                  type="checkbox"
                  className="h-5 w-5"
                  aria-label={`Tick order ${o.orderNumber}`}
                  checked={ticked.has(o.id)}
                  onChange={(e) => onTick(o.id, e.target.checked)}
                />
              </td>
              <td className="p-2 font-semibold">{o.orderNumber}</td>
              <td className="p-2">{o.cutoffAt ? formatDateTime(o.cutoffAt, style) : "no cut-off"}</td>
              <td className="p-2">{o.priority}</td>
              <td className="p-2">{o.lineCount}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function useTicks() {
  const [ticked, setTicked] = useState<Set<number>>(new Set());
  const onTick = (id: number, on: boolean) =>
    setTicked((t) => {
      const n = new Set(t);
      if (on) n.add(id);
      else n.delete(id);
      return n;
    });
  return { ticked, onTick };
}

/** Orders in and out of the wave: tick them by hand, or take every one matching a cut-off and priorities. */
export function WaveOrdersEditor({ waveId, version, planned }: { waveId: number; version: number; planned: boolean }) {
  const { data, error } = useSWR<WaveOrdersDTO>(`/api/waves/${waveId}/orders`, swrFetcher, {
    revalidateOnFocus: false,
  });
  const inWave = useTicks();
  const open = useTicks();
  const [cutoff, setCutoff] = useState("");
  const [noCutoffToo, setNoCutoffToo] = useState(false);
  const [priorities, setPriorities] = useState([1, 2, 3]);
  const [failure, setFailure] = useState<ApiFailure | null>(null);
  const [busy, setBusy] = useState(false);

  async function send(change: Record<string, unknown>) {
    setBusy(true);
    setFailure(null);
    const r = await postJson(`/api/waves/${waveId}/orders`, { version, ...change });
    if (r.ok) return window.location.reload();
    setBusy(false);
    setFailure(r);
  }

  const filter = () => {
    if (priorities.length === 0) {
      setFailure({ ok: false, status: 0, message: "Tick at least one priority for the filter." });
      return null;
    }
    const at = isoOf(cutoff);
    return { priorities, ...(at ? { cutoffBefore: at, includeNoCutoff: noCutoffToo } : {}) };
  };
  const planNote = planned ? " This throws the plan away." : "";

  return (
    <section className="space-y-4" aria-labelledby="wave-orders-title">
      <h3 id="wave-orders-title" className="text-lg font-semibold">
        Orders
      </h3>
      {error && <p className="notice-error">{(error as Error).message}</p>}
      {!data && !error && <p className="text-ink-soft">Loading the orders…</p>}
      {data && (
        <div className="grid gap-4 lg:grid-cols-2">
          <div className="space-y-2">
            <h4 className="font-semibold">In this wave ({data.inWave.length})</h4>
            {data.inWave.length === 0 ? (
              <p className="text-ink-soft">No orders: add some before planning.</p>
            ) : (
              <OrderTable label="Orders in this wave" rows={data.inWave} {...inWave} />
            )}
            <button
              type="button"
              className="btn-quiet"
              disabled={busy || inWave.ticked.size === 0}
              onClick={() => send({ remove: [...inWave.ticked] })}
            >
              Take {inWave.ticked.size || "the ticked"} order{inWave.ticked.size === 1 ? "" : "s"} out
            </button>
          </div>
          <div className="space-y-2">
            <h4 className="font-semibold">
              Open orders in no wave ({data.candidateCount}
              {data.candidateCount > data.candidates.length ? `, the ${data.candidates.length} most urgent shown` : ""})
            </h4>
            {data.candidates.length === 0 ? (
              <p className="text-ink-soft">Every open order is in a wave already.</p>
            ) : (
              <OrderTable label="Open orders to add" rows={data.candidates} {...open} />
            )}
            <button
              type="button"
              className="btn-quiet"
              disabled={busy || open.ticked.size === 0}
              onClick={() => send({ add: [...open.ticked] })}
            >
              Add {open.ticked.size || "the ticked"} order{open.ticked.size === 1 ? "" : "s"}
            </button>
          </div>
        </div>
      )}
      <fieldset className="space-y-3 rounded-md border border-rack-light p-3">
        <legend className="label px-1">By filter</legend>
        <div className="flex flex-wrap items-end gap-4">
          <label>
            <span className="label text-sm">Cut-off up to (optional)</span>
            <input
              type="datetime-local"
              className="field"
              value={cutoff}
              onChange={(e) => setCutoff(e.target.value)}
              aria-label="Filter cut-off up to"
            />
          </label>
          <label className="flex min-h-tap items-center gap-2">
            <input type="checkbox" checked={noCutoffToo} onChange={(e) => setNoCutoffToo(e.target.checked)} />
            <span className="text-sm">and orders with no cut-off</span>
          </label>
          <div>
            <span className="label text-sm">Priorities</span>
            <div className="flex flex-wrap gap-2">
              {[1, 2, 3].map((p) => (
                <label key={p} className="flex min-h-tap items-center gap-2 rounded-md border-2 border-rack-light px-3">
                  <input
                    type="checkbox"
                    className="h-5 w-5"
                    checked={priorities.includes(p)}
                    aria-label={`Filter priority ${p}`}
                    onChange={(e) =>
                      setPriorities((ps) => (e.target.checked ? [...ps, p].sort() : ps.filter((x) => x !== p)))
                    }
                  />
                  {p}
                </label>
              ))}
            </div>
          </div>
        </div>
        <div className="flex flex-wrap gap-2">
          <button
            type="button"
            className="btn-quiet"
            disabled={busy}
            onClick={() => {
              const f = filter();
              if (f) void send({ addMatching: f });
            }}
          >
            Add every matching open order
          </button>
          <button
            type="button"
            className="btn-quiet"
            disabled={busy}
            onClick={() => {
              const f = filter();
              if (f) void send({ removeMatching: f });
            }}
          >
            Take every matching order out
          </button>
        </div>
        <p className="text-sm text-ink-soft">Orders taken out go back to open, ready for another wave.{planNote}</p>
      </fieldset>
      <FailureNotice failure={failure} />
    </section>
  );
}

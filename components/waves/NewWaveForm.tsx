"use client";

import { useState } from "react";
import { postJson, type ApiFailure } from "@/lib/client/fetch-json";
import { FailureNotice } from "@/components/FailureNotice";
import { WavePreview } from "./WavePreview";
import { CartSettingsFields, readCartSettings } from "./CartSettingsFields";
import type { LayoutChoice } from "@/lib/contracts/layout-versions";

/** A datetime-local value (the planner's local time) as an ISO instant, or undefined when empty or unfinished. */
function isoOf(local: string): string | undefined {
  if (!local) return undefined;
  const d = new Date(local);
  return Number.isNaN(d.getTime()) ? undefined : d.toISOString();
}

/** A new wave's cart fields start here; its depot and drop-off at the layout version's first. */
const NEW_WAVE_DEFAULTS = { totesPerCart: 6, maxLines: 30, maxWeightG: 120_000, method: "savings" } as const;

export function NewWaveForm({ layouts }: { layouts: LayoutChoice[] }) {
  const [layoutId, setLayoutId] = useState(layouts[0]?.id ?? 0);
  const [failure, setFailure] = useState<ApiFailure | null>(null);
  const [busy, setBusy] = useState(false);
  const [cutoff, setCutoff] = useState("");
  const [priorities, setPriorities] = useState([1, 2, 3]);
  // Orders without a cut-off are left out by a cut-off filter unless the planner takes them too.
  const [includeNoCutoff, setIncludeNoCutoff] = useState(false);
  const layout = layouts.find((l) => l.id === layoutId);
  const cutoffIso = isoOf(cutoff);
  // The same filter the wave is created with, so the count shown is the count taken.
  const previewQuery =
    priorities.length === 0
      ? null
      : new URLSearchParams({
          layoutVersionId: String(layoutId),
          priorities: priorities.join(","),
          ...(cutoffIso ? { cutoffBefore: cutoffIso } : {}),
          ...(cutoffIso && includeNoCutoff ? { includeNoCutoff: "1" } : {}),
        }).toString();

  if (layouts.length === 0) {
    return (
      <p className="notice-info mt-8">
        Waves are planned on a published floor plan. Ask a layout admin to publish one first.
      </p>
    );
  }

  async function submit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    if (busy) return;
    if (priorities.length === 0)
      return setFailure({
        ok: false,
        status: 0,
        message: "Tick at least one priority: a wave takes orders of the priorities ticked.",
      });
    const f = new FormData(e.currentTarget);
    setBusy(true);
    const r = await postJson<{ id: number }>("/api/waves", {
      name: String(f.get("name") ?? ""),
      layoutVersionId: layoutId,
      settings: readCartSettings(f),
      cutoffBefore: cutoffIso,
      priorities,
      ...(cutoffIso ? { includeNoCutoff } : {}),
    });
    if (r.ok) return window.location.assign(`/waves/${r.data.id}`);
    setFailure(r);
    setBusy(false);
  }

  return (
    <form onSubmit={submit} className="card mt-8 max-w-4xl space-y-5" noValidate aria-labelledby="new-wave">
      <h2 id="new-wave">Start a wave</h2>
      <div className="grid gap-4 sm:grid-cols-2">
        <label>
          <span className="label">Name</span>
          <input name="name" className="field" required maxLength={120} placeholder="e.g. Tuesday morning" />
        </label>
        <label>
          <span className="label">Layout version</span>
          <select className="field" value={layoutId} onChange={(e) => setLayoutId(Number(e.target.value))}>
            {layouts.map((l) => (
              <option key={l.id} value={l.id}>
                {l.label}
              </option>
            ))}
          </select>
        </label>
      </div>
      <fieldset className="grid gap-4 sm:grid-cols-3">
        <legend className="label">Which open orders</legend>
        <label>
          <span className="label text-sm">Cut-off up to (optional)</span>
          <input
            name="cutoffBefore"
            type="datetime-local"
            className="field"
            value={cutoff}
            onChange={(e) => setCutoff(e.target.value)}
          />
        </label>
        <div className="sm:col-span-2">
          <span className="label text-sm">Priorities</span>
          <div className="flex flex-wrap gap-3">
            {[1, 2, 3].map((p) => (
              <label key={p} className="flex min-h-tap items-center gap-2 rounded-md border-2 border-rack-light px-3">
                <input
                  type="checkbox"
                  name="priority"
                  value={p}
                  checked={priorities.includes(p)}
                  onChange={(e) =>
                    setPriorities((ps) => (e.target.checked ? [...ps, p].sort() : ps.filter((x) => x !== p)))
                  }
                  className="h-5 w-5"
                />{" "}
                {p === 1 ? "1 (urgent)" : p === 2 ? "2 (normal)" : "3 (low)"}
              </label>
            ))}
          </div>
        </div>
      </fieldset>
      <WavePreview
        query={previewQuery}
        layoutLabel={layout?.label ?? "this layout version"}
        noCutoff={!cutoffIso}
        includeNoCutoff={includeNoCutoff}
        onIncludeNoCutoff={setIncludeNoCutoff}
      />
      <CartSettingsFields legend="Cart" defaults={NEW_WAVE_DEFAULTS} ends={layout} />
      <FailureNotice failure={failure} />
      <button className="btn-primary" disabled={busy}>
        {busy ? "Creating…" : "Create the wave"}
      </button>
    </form>
  );
}

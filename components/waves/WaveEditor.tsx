"use client";

import { useState } from "react";
import { patchJson, postJson, type ApiFailure } from "@/lib/client/fetch-json";
import { FailureNotice } from "@/components/FailureNotice";
import { JobProgress } from "@/components/JobProgress";
import type { WaveDTO, WaveSettings } from "@/lib/contracts/waves";
import { WaveOrdersEditor } from "./WaveOrdersEditor";

type Ends = { depots: { id: string; name: string }[]; dropoffs: { id: string; name: string }[] };

type Props = {
  waveId: number;
  name: string;
  status: "draft" | "planned";
  version: number;
  settings: WaveSettings;
  batchCount: number;
  ends: Ends;
  onClose: () => void;
};

/**
 * A draft or planned wave's name, cart limits, depot and drop-off, batching method and orders. New
 * settings or orders throw a planned wave's plan away (the server deletes its batches and makes it a
 * draft); "Save and re-plan" then plans it again with what was saved.
 */
export function WaveEditor({ waveId, name, status, version, settings, batchCount, ends, onClose }: Props) {
  const [failure, setFailure] = useState<ApiFailure | null>(null);
  const [busy, setBusy] = useState(false);
  const [jobId, setJobId] = useState<string | null>(null);
  const planned = status === "planned";

  function read(form: HTMLFormElement): { name: string; settings: WaveSettings } {
    const f = new FormData(form);
    return {
      name: String(f.get("name") ?? ""),
      settings: {
        totesPerCart: Number(f.get("totesPerCart")),
        maxLines: Number(f.get("maxLines")),
        maxWeightG: Math.round(Number(f.get("maxWeightKg")) * 1000),
        depotId: String(f.get("depotId")),
        dropoffId: String(f.get("dropoffId")),
        method: String(f.get("method")) as WaveSettings["method"],
      },
    };
  }

  async function save(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    if (busy) return;
    const andPlan = (e.nativeEvent as SubmitEvent).submitter?.getAttribute("value") === "plan";
    const next = read(e.currentTarget);
    const changed: { name?: string; settings?: Partial<WaveSettings> } = {};
    if (next.name.trim() !== name) changed.name = next.name;
    const diff = (Object.keys(next.settings) as (keyof WaveSettings)[]).filter((k) => next.settings[k] !== settings[k]);
    if (diff.length) changed.settings = Object.fromEntries(diff.map((k) => [k, next.settings[k]]));
    setBusy(true);
    setFailure(null);
    let at = version;
    if (changed.name !== undefined || changed.settings) {
      const r = await patchJson<{ wave: WaveDTO }>(`/api/waves/${waveId}`, { version, ...changed });
      if (!r.ok) {
        setBusy(false);
        return setFailure(r);
      }
      at = r.data.wave.version;
    } else if (!andPlan) {
      setBusy(false);
      return setFailure({ ok: false, status: 0, message: "Nothing changed: change the name or a setting first." });
    }
    if (!andPlan) return window.location.reload();
    const p = await postJson<{ jobId: string }>(`/api/waves/${waveId}/plan`, { version: at });
    if (!p.ok) {
      setBusy(false);
      return setFailure(p);
    }
    setJobId(p.data.jobId);
  }

  return (
    <section className="card mt-4 space-y-5" aria-labelledby="edit-wave-title">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id="edit-wave-title">Edit the wave</h2>
        <button type="button" className="btn-quiet" onClick={onClose} disabled={busy}>
          Close the editor
        </button>
      </div>
      {planned && (
        <p className="notice-info" role="note">
          ⚠ This wave is planned. Saving new settings, or adding or taking out orders, throws its plan away: its{" "}
          {batchCount === 1 ? "batch is" : `${batchCount} batches are`} deleted (pick lists printed for them no longer
          count) and the wave is a draft again until it is planned. “Save and re-plan” plans it again at once with what
          you saved. A new name alone keeps the plan.
        </p>
      )}
      {jobId ? (
        <JobProgress
          jobId={jobId}
          what="Planning"
          cancellable
          onFinished={() => window.setTimeout(() => window.location.reload(), 800)}
          done={(_r, message) => <>{message}. Loading the batches…</>}
        />
      ) : (
        <form onSubmit={save} className="space-y-4" noValidate aria-label="Name and settings">
          <label className="block max-w-xl">
            <span className="label">Name</span>
            <input name="name" className="field" required maxLength={120} defaultValue={name} />
          </label>
          <fieldset className="grid gap-4 sm:grid-cols-3">
            <legend className="label">Cart and route</legend>
            <label>
              <span className="label text-sm">Totes per cart (one order per tote)</span>
              <input
                name="totesPerCart"
                type="number"
                min={1}
                max={40}
                defaultValue={settings.totesPerCart}
                className="field"
              />
            </label>
            <label>
              <span className="label text-sm">Most lines per batch</span>
              <input
                name="maxLines"
                type="number"
                min={1}
                max={500}
                defaultValue={settings.maxLines}
                className="field"
              />
            </label>
            <label>
              <span className="label text-sm">Most weight per cart (kg)</span>
              <input
                name="maxWeightKg"
                type="number"
                min={1}
                step="0.5"
                defaultValue={settings.maxWeightG / 1000}
                className="field"
              />
            </label>
            <label>
              <span className="label text-sm">Carts start at</span>
              <select name="depotId" className="field" defaultValue={settings.depotId}>
                {ends.depots.map((d) => (
                  <option key={d.id} value={d.id}>
                    {d.name} ({d.id})
                  </option>
                ))}
              </select>
            </label>
            <label>
              <span className="label text-sm">Carts end at</span>
              <select name="dropoffId" className="field" defaultValue={settings.dropoffId}>
                {ends.dropoffs.map((d) => (
                  <option key={d.id} value={d.id}>
                    {d.name} ({d.id})
                  </option>
                ))}
              </select>
            </label>
            <label>
              <span className="label text-sm">Batching</span>
              <select name="method" className="field" defaultValue={settings.method}>
                <option value="savings">By route savings (least added walking)</option>
                <option value="first-come">First come, by cut-off</option>
              </select>
            </label>
          </fieldset>
          <p className="text-sm text-ink-soft">
            Check the cart weight limit against your site&apos;s rules for pushing carts and lifting; Trailbin does not
            know them.
          </p>
          <FailureNotice failure={failure} />
          <div className="flex flex-wrap gap-2">
            <button className="btn-primary" name="then" value="plan" disabled={busy}>
              {planned ? "Save and re-plan" : "Save and plan"}
            </button>
            <button className="btn-quiet" name="then" value="save" disabled={busy}>
              {busy ? "Saving…" : "Save changes"}
            </button>
          </div>
        </form>
      )}
      {!jobId && <WaveOrdersEditor waveId={waveId} version={version} planned={planned} />}
    </section>
  );
}

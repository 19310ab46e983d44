"use client";

import { useState } from "react";
import { patchJson, postJson, type ApiFailure } from "@/lib/client/fetch-json";
import { FailureNotice } from "@/components/FailureNotice";
import { JobProgress } from "@/components/JobProgress";
import type { WaveDTO, WaveSettings } from "@/lib/contracts/waves";
import { WaveOrdersEditor } from "./WaveOrdersEditor";
import { CartSettingsFields, readCartSettings, type CartEnds } from "./CartSettingsFields";

type Props = {
  waveId: number;
  name: string;
  status: "draft" | "planned";
  version: number;
  settings: WaveSettings;
  batchCount: number;
  ends: CartEnds;
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
      settings: readCartSettings(f),
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
          <CartSettingsFields legend="Cart and route" defaults={settings} ends={ends} />
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

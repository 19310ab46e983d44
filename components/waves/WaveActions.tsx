"use client";

import { useRef, useState } from "react";
import { postJson } from "@/lib/client/fetch-json";
import { JobProgress } from "@/components/JobProgress";
import type { WaveSettings } from "@/lib/contracts/waves";
import { ReleaseDialog, releaseWords } from "./ReleaseDialog";
import { WaveEditor } from "./WaveEditor";

type Props = {
  waveId: number;
  status: "draft" | "planned" | "released";
  version: number;
  canPlan: boolean;
  batchCount: number;
  unbatchedCount: number;
  orderCount: number;
  /** What the editor needs; absent for a released wave or a reader who may not plan. */
  editor?: {
    name: string;
    settings: WaveSettings;
    ends: { depots: { id: string; name: string }[]; dropoffs: { id: string; name: string }[] };
  };
};

export function WaveActions({
  waveId,
  status,
  version,
  canPlan,
  batchCount,
  unbatchedCount,
  orderCount,
  editor,
}: Props) {
  const [jobId, setJobId] = useState<string | null>(null);
  const [asking, setAsking] = useState(false);
  const [cancelling, setCancelling] = useState(false);
  const [editing, setEditing] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const releaseButton = useRef<HTMLButtonElement>(null);

  async function plan() {
    setBusy(true);
    setError(null);
    const r = await postJson<{ jobId: string }>(`/api/waves/${waveId}/plan`, { version });
    setBusy(false);
    if (r.ok) setJobId(r.data.jobId);
    else setError(r.message);
  }

  const words = releaseWords(batchCount, unbatchedCount);

  async function release() {
    setBusy(true);
    setError(null);
    const r = await postJson(`/api/waves/${waveId}/release`, { version });
    if (r.ok) return window.location.reload();
    setAsking(false);
    setBusy(false);
    setError(r.message);
  }

  // Cancelling an unreleased wave is the discard route: the wave goes, its orders are open again.
  async function cancelWave() {
    setCancelling(false);
    setBusy(true);
    setError(null);
    const r = await postJson(`/api/waves/${waveId}/discard`, { version });
    if (r.ok) return window.location.assign("/waves");
    setBusy(false);
    setError(r.message);
  }

  const editable = canPlan && status !== "released" && !!editor;

  return (
    <>
      <div className="card mt-4 space-y-3">
        <p className="font-semibold">
          {status === "draft" && "◌ Draft: not planned yet. Edit its orders and settings, or plan it."}
          {status === "planned" &&
            "◐ Planned: check the batches, re-plan with other settings, or release them to the pickers."}
          {status === "released" &&
            (batchCount > 0
              ? "● Released: the batches are locked and on the pickers' handhelds."
              : "● Closed: nothing was batched; its orders went back to open.")}
        </p>
        {canPlan && status !== "released" && !jobId && (
          <div className="flex flex-wrap gap-2">
            {status === "draft" ? (
              <button type="button" className="btn-primary" onClick={plan} disabled={busy}>
                Plan the wave
              </button>
            ) : (
              <button
                type="button"
                className="btn-primary"
                onClick={() => setEditing(true)}
                disabled={busy || editing || !editable}
              >
                Re-plan…
              </button>
            )}
            {status === "planned" && (
              <button
                type="button"
                ref={releaseButton}
                className="btn-quiet"
                onClick={() => setAsking(true)}
                disabled={busy}
              >
                {words.button}
              </button>
            )}
            {editable && (
              <button type="button" className="btn-quiet" onClick={() => setEditing(true)} disabled={busy || editing}>
                Edit wave
              </button>
            )}
            <button
              type="button"
              className="btn-quiet"
              onClick={() => setCancelling(true)}
              disabled={busy || cancelling}
            >
              Cancel wave
            </button>
          </div>
        )}
        {cancelling && (
          <div className="notice-info space-y-3" role="alertdialog" aria-labelledby="cancel-question">
            <p id="cancel-question">
              Cancel this wave? Its {orderCount === 1 ? "order goes" : `${orderCount} orders go`} back to open orders,
              ready for another wave, and the wave is removed
              {status === "planned" ? "; its batches and any pick lists printed for them no longer count" : ""}.
            </p>
            <div className="flex flex-wrap gap-2">
              <button type="button" className="btn-danger" onClick={cancelWave} disabled={busy}>
                Yes, cancel the wave
              </button>
              <button type="button" className="btn-quiet" onClick={() => setCancelling(false)}>
                Keep the wave
              </button>
            </div>
          </div>
        )}
        {jobId && (
          <JobProgress
            jobId={jobId}
            what="Planning"
            cancellable
            onFinished={() => window.setTimeout(() => window.location.reload(), 800)}
            done={(_r, message) => <>{message}. Loading the batches…</>}
          />
        )}
        {error && (
          <p role="alert" className="notice-error">
            {error}
          </p>
        )}
      </div>
      {status === "planned" && (
        <ReleaseDialog
          open={asking}
          batchCount={batchCount}
          unbatchedCount={unbatchedCount}
          busy={busy}
          onConfirm={release}
          onClose={() => {
            setAsking(false);
            releaseButton.current?.focus();
          }}
        />
      )}
      {editing && editable && editor && (
        <WaveEditor
          waveId={waveId}
          name={editor.name}
          status={status}
          version={version}
          settings={editor.settings}
          batchCount={batchCount}
          ends={editor.ends}
          onClose={() => setEditing(false)}
        />
      )}
    </>
  );
}

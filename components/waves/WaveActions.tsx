"use client";

import { useState } from "react";
import { postJson } from "@/lib/client/fetch-json";
import { JobProgress } from "@/components/JobProgress";

export function WaveActions({ waveId, status, version, canPlan }: { waveId: number; status: "draft" | "planned" | "released"; version: number; canPlan: boolean }) {
  const [jobId, setJobId] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function plan() {
    setBusy(true);
    setError(null);
    const r = await postJson<{ jobId: string }>(`/api/waves/${waveId}/plan`, { version });
    setBusy(false);
    if (r.ok) setJobId(r.data.jobId);
    else setError(r.message);
  }

  async function release() {
    setBusy(true);
    setError(null);
    const r = await postJson(`/api/waves/${waveId}/release`, { version });
    if (r.ok) return window.location.reload();
    setBusy(false);
    setError(r.message);
  }

  return (
    <div className="card mt-4 space-y-3">
      <p className="font-semibold">
        {status === "draft" && "◌ Draft: not planned yet."}
        {status === "planned" && "◐ Planned: check the batches, re-plan with other settings, or release them to the pickers."}
        {status === "released" && "● Released: the batches are locked and on the pickers' handhelds."}
      </p>
      {canPlan && status !== "released" && !jobId && (
        <div className="flex flex-wrap gap-2">
          <button type="button" className="btn-primary" onClick={plan} disabled={busy}>{status === "draft" ? "Plan the wave" : "Re-plan"}</button>
          {status === "planned" && <button type="button" className="btn-quiet" onClick={release} disabled={busy}>Release to pickers</button>}
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
      {error && <p role="alert" className="notice-error">{error}</p>}
    </div>
  );
}

"use client";

import { useState } from "react";
import { postJson } from "@/lib/client/fetch-json";
import { JobProgress } from "@/components/JobProgress";

type Props = {
  waveId: number;
  status: "draft" | "planned" | "released";
  version: number;
  canPlan: boolean;
  batchCount: number;
  unbatchedCount: number;
  orderCount: number;
};

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/** What releasing does, in the words of the button and of the question before it. */
function releaseWords(batchCount: number, unbatchedCount: number): { button: string; question: string | null } {
  const orders = plural(unbatchedCount, "order", "orders");
  if (batchCount === 0) {
    return {
      button: `Hand all ${orders} back to open`,
      question: `No order of this wave could be batched, so there is nothing for the pickers. Close the wave and hand its ${orders} back to open orders, with the reasons kept on the orders page?`,
    };
  }
  const batches = plural(batchCount, "batch", "batches");
  if (unbatchedCount === 0) return { button: "Release to pickers", question: null };
  return {
    button: `Release ${batches}; ${orders} back to open`,
    question: `Release ${batches} to the pickers? The ${orders} no batch holds ${unbatchedCount === 1 ? "goes" : "go"} back to open orders, with ${unbatchedCount === 1 ? "its reason" : "their reasons"} kept on the orders page, to go in a later wave once fixed. Released batches are locked.`,
  };
}

export function WaveActions({ waveId, status, version, canPlan, batchCount, unbatchedCount, orderCount }: Props) {
  const [jobId, setJobId] = useState<string | null>(null);
  const [asking, setAsking] = useState(false);
  const [discarding, setDiscarding] = useState(false);
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

  const words = releaseWords(batchCount, unbatchedCount);

  async function release() {
    setAsking(false);
    setBusy(true);
    setError(null);
    const r = await postJson(`/api/waves/${waveId}/release`, { version });
    if (r.ok) return window.location.reload();
    setBusy(false);
    setError(r.message);
  }

  async function discard() {
    setDiscarding(false);
    setBusy(true);
    setError(null);
    const r = await postJson(`/api/waves/${waveId}/discard`, { version });
    if (r.ok) return window.location.assign("/waves");
    setBusy(false);
    setError(r.message);
  }

  return (
    <div className="card mt-4 space-y-3">
      <p className="font-semibold">
        {status === "draft" && "◌ Draft: not planned yet."}
        {status === "planned" &&
          "◐ Planned: check the batches, re-plan with other settings, or release them to the pickers."}
        {status === "released" &&
          (batchCount > 0
            ? "● Released: the batches are locked and on the pickers' handhelds."
            : "● Closed: nothing was batched; its orders went back to open.")}
      </p>
      {canPlan && status !== "released" && !jobId && (
        <div className="flex flex-wrap gap-2">
          <button type="button" className="btn-primary" onClick={plan} disabled={busy}>
            {status === "draft" ? "Plan the wave" : "Re-plan"}
          </button>
          {status === "planned" && (
            <button
              type="button"
              className="btn-quiet"
              onClick={words.question ? () => setAsking(true) : release}
              disabled={busy || asking}
            >
              {words.button}
            </button>
          )}
          <button type="button" className="btn-quiet" onClick={() => setDiscarding(true)} disabled={busy || discarding}>
            Discard the wave
          </button>
        </div>
      )}
      {discarding && (
        <div className="notice-info space-y-3" role="alertdialog" aria-labelledby="discard-question">
          <p id="discard-question">
            Discard this wave? Its {orderCount === 1 ? "order goes" : `${orderCount} orders go`} back to open orders,
            ready for another wave
            {status === "planned" ? "; its batches and any pick lists printed for them no longer count" : ""}.
          </p>
          <div className="flex flex-wrap gap-2">
            <button type="button" className="btn-primary" onClick={discard} disabled={busy}>
              Yes, discard it
            </button>
            <button type="button" className="btn-quiet" onClick={() => setDiscarding(false)}>
              Keep the wave
            </button>
          </div>
        </div>
      )}
      {asking && words.question && (
        <div className="notice-info space-y-3" role="alertdialog" aria-labelledby="release-question">
          <p id="release-question">{words.question}</p>
          <div className="flex flex-wrap gap-2">
            <button type="button" className="btn-primary" onClick={release} disabled={busy}>
              {batchCount === 0 ? "Yes, hand them back" : "Yes, release"}
            </button>
            <button type="button" className="btn-quiet" onClick={() => setAsking(false)}>
              Not yet
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
  );
}

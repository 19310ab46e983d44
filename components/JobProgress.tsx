"use client";

import useSWR from "swr";
import { requestJson, swrFetcher } from "@/lib/client/fetch-json";
import type { JobDTO } from "@/lib/contracts/jobs";

type Job = Pick<JobDTO, "status" | "progress" | "message" | "result">;

/** Follows a long job (publishing, planning) with a progress bar until it ends; optionally cancellable. */
export function JobProgress({
  jobId,
  what,
  done,
  onFinished,
  cancellable = false,
}: {
  jobId: string;
  what: string;
  done: (result: unknown, message: string) => React.ReactNode;
  onFinished?: () => void;
  cancellable?: boolean;
}) {
  const url = `/api/jobs/${encodeURIComponent(jobId)}`;
  const { data, error, mutate } = useSWR<{ job: Job }>(url, swrFetcher, {
    refreshInterval: (latest) => (latest && ["done", "failed", "cancelled"].includes(latest.job.status) ? 0 : 500),
    onSuccess: (d) => {
      if (d.job.status === "done") onFinished?.();
    },
  });
  if (error)
    return (
      <p className="notice-error" role="alert">
        Could not follow the {what.toLowerCase()}: {(error as Error).message}
      </p>
    );
  if (!data) return <p role="status">{what}…</p>;
  const { job } = data;
  const pct = Math.round(Math.max(0, Math.min(1, job.progress)) * 100);
  if (job.status === "done")
    return (
      <div className="notice-info" role="status">
        {done(job.result, job.message)}
      </div>
    );
  if (job.status === "failed" || job.status === "cancelled") {
    return (
      <p className="notice-error" role="alert">
        {what} {job.status === "failed" ? "failed" : "was cancelled"}: {job.message}
      </p>
    );
  }
  return (
    <div className="space-y-2" role="status" aria-live="polite">
      <div className="flex justify-between gap-3 text-sm">
        <span>{job.message || (job.status === "queued" ? "Waiting for a free worker…" : `${what}…`)}</span>
        <span>{pct} %</span>
      </div>
      <progress className="h-3 w-full accent-trail" max={100} value={pct} aria-label={`${what} progress`}>
        {pct} %
      </progress>
      {cancellable && (
        <button
          type="button"
          className="btn-quiet"
          onClick={async () => {
            await requestJson("DELETE", url);
            await mutate();
          }}
        >
          Cancel
        </button>
      )}
    </div>
  );
}

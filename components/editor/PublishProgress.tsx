"use client";

import Link from "next/link";
import useSWR from "swr";
import { swrFetcher } from "@/lib/client/fetch-json";
import type { JobResponse } from "./api";

/** Follows a publish job until it is done, failed or cancelled. */
export function PublishProgress({ planId, jobId, onFinished }: { planId: number; jobId: string; onFinished?: () => void }) {
  const { data, error } = useSWR<JobResponse>(`/api/jobs/${encodeURIComponent(jobId)}`, swrFetcher, {
    refreshInterval: (latest) => (latest && ["done", "failed", "cancelled"].includes(latest.job.status) ? 0 : 500),
    onSuccess: (d) => {
      if (d.job.status === "done") onFinished?.();
    },
  });
  if (error) return <p className="notice-error" role="alert">Could not follow the publishing: {error.message}</p>;
  if (!data) return <p role="status">Publishing…</p>;
  const { job } = data;
  const pct = Math.round(Math.max(0, Math.min(1, job.progress)) * 100);
  if (job.status === "done" && job.result) {
    return (
      <p className="notice-info" role="status">
        Layout version {job.result.number} is published. <Link className="font-semibold underline" href={`/floor-plans/${planId}/versions/${job.result.number}`}>Open layout version {job.result.number}</Link>
      </p>
    );
  }
  if (job.status === "failed" || job.status === "cancelled") {
    return (
      <p className="notice-error" role="alert">
        Publishing {job.status === "failed" ? "failed" : "was cancelled"}: {job.message}
      </p>
    );
  }
  return (
    <div className="space-y-1" role="status" aria-live="polite">
      <div className="flex justify-between text-sm">
        <span>{job.message || (job.status === "queued" ? "Waiting for a free worker…" : "Computing walking distances…")}</span>
        <span>{pct} %</span>
      </div>
      <progress className="h-3 w-full accent-trail" max={100} value={pct} aria-label="Publishing progress">
        {pct} %
      </progress>
    </div>
  );
}

"use client";

import Link from "next/link";
import { JobProgress } from "@/components/JobProgress";

/** Follows a publish job until it is done, failed or cancelled. */
export function PublishProgress({
  planId,
  jobId,
  onFinished,
}: {
  planId: number;
  jobId: string;
  onFinished?: () => void;
}) {
  return (
    <JobProgress
      jobId={jobId}
      what="Publishing"
      onFinished={onFinished}
      done={(result) => {
        const number = (result as { number?: number } | null)?.number;
        return (
          <>
            Layout version {number} is published.{" "}
            <Link className="font-semibold underline" href={`/floor-plans/${planId}/versions/${number}`}>
              Open layout version {number}
            </Link>
          </>
        );
      }}
    />
  );
}

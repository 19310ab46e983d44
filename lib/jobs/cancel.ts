import "server-only";
import type { Knex } from "knex";
import { updateJob } from "@/db/jobs";

// Jobs run in this server process; a cancel request finds the running one here.
const globalForJobs = globalThis as unknown as { trailbinJobAborts?: Map<string, AbortController> };
const aborts = () => (globalForJobs.trailbinJobAborts ??= new Map());

export function cancellable(jobId: string): AbortSignal {
  const c = new AbortController();
  aborts().set(jobId, c);
  return c.signal;
}

export function finished(jobId: string): void {
  aborts().delete(jobId);
}

/** Tells the job's work in this process to stop; the job's row says "cancelled" already. */
export function stopWork(jobId: string): void {
  aborts().get(jobId)?.abort();
}

/** The job ended (cancelled) before its work could store a result; the work drops what it made. */
export class JobNoLongerRunning extends Error {
  constructor(readonly jobId: string) {
    super(`job ${jobId} is no longer running`);
  }
}

/**
 * Marks the job done inside the transaction that stores its result. A job cancelled meanwhile makes
 * this throw, which rolls the result back: a cancel that answered 202 leaves nothing behind.
 */
export async function finishJobIn(trx: Knex.Transaction, jobId: string, done: { message: string; result: unknown }): Promise<void> {
  if (!(await updateJob(jobId, { status: "done", progress: 1, ...done }, trx))) throw new JobNoLongerRunning(jobId);
}

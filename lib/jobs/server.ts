import "server-only";
import { claimJob, createOrJoinJob, failOrphanedJobs, getJob, updateJob } from "@/db/jobs";
import { createJobRunner, type JobRunner } from "./runner";
import { inProcessQueue } from "./queue";

// One runner per server process, shared by every route bundle: its kinds and its cancel fast path.
const globalForJobs = globalThis as unknown as { trailbinJobRunner?: JobRunner };
const runner = (globalForJobs.trailbinJobRunner ??= createJobRunner({ createOrJoin: createOrJoinJob, claim: claimJob, update: updateJob, get: getJob }, inProcessQueue));

export const { defineJob, startJob, watchJob, cancelJob } = runner;
export { JobNoLongerRunning } from "./runner";

/**
 * The in-process queue's jobs die with the process that ran them: at start, the ones a previous
 * server left queued or running are marked failed instead of spinning forever.
 */
export async function failJobsOfPreviousRun(): Promise<number> {
  return failOrphanedJobs();
}

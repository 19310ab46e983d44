import "server-only";
import { claimJob, createOrJoinJob, failOrphanedJobs, getJob, updateJob } from "@/db/jobs";
import { createJobRunner, newRunnerState, type RunnerState } from "./runner";
import { inProcessQueue } from "./queue";

// Route bundles may each load their own copy of this module; they share the kinds and the running
// jobs through globalThis, while each copy throws its own bundle's HttpError for route() to recognise.
const globalForJobs = globalThis as unknown as { trailbinJobs?: RunnerState };
const state = (globalForJobs.trailbinJobs ??= newRunnerState());

export const { defineJob, startJob, watchJob, cancelJob } = createJobRunner(
  { createOrJoin: createOrJoinJob, claim: claimJob, update: updateJob, get: getJob },
  inProcessQueue,
  state,
);

/**
 * The in-process queue's jobs die with the process that ran them: at start, the ones a previous
 * server left queued or running are marked failed instead of spinning forever.
 */
export async function failJobsOfPreviousRun(): Promise<number> {
  return failOrphanedJobs();
}

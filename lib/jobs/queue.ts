/**
 * Where a started job waits for a worker. The runner hands over only the job's id; whoever takes it
 * runs it from its row (`claimJob` lets exactly one taker have it), so a distributed queue with
 * several worker processes can replace the in-process one behind the same runner.
 */
export interface JobQueue {
  enqueue(jobId: string): void;
}

/** Today's queue: the job runs in this server process at once, its CPU-heavy parts in worker pools. */
export function inProcessQueue(run: (jobId: string) => Promise<void>): JobQueue {
  return {
    enqueue: (jobId) => void run(jobId).catch((e: unknown) => console.error(`job ${jobId} could not be run`, e)),
  };
}

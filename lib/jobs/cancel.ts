import "server-only";

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

/** True when the job was running here and has been told to stop. */
export function cancelJob(jobId: string): boolean {
  const c = aborts().get(jobId);
  if (!c) return false;
  c.abort();
  return true;
}

// The planner during the load: plan the 1,000-order wave through the API and follow the job as the
// browser does (polling GET /api/jobs/[id]), timing the whole plan and each request.
import type { Api } from "./api";

export type PlanOutcome = {
  status: string;
  message: string;
  seconds: number;
  batches: number | null;
  startMs: number;
  pollMs: number[];
  startedAt: number;
  finishedAt: number;
};

export async function planDuringLoad(
  a: Api,
  cookie: string,
  wave: { id: number; version: number },
  opts: { pollEveryMs: number; giveUpAfterMs: number },
): Promise<PlanOutcome> {
  const t0 = performance.now();
  const started = await a.call<{ jobId: string }>("POST", `/api/waves/${wave.id}/plan`, {
    cookie,
    json: { version: wave.version },
    expect: [202],
  });
  const pollMs: number[] = [];
  for (;;) {
    await new Promise((r) => setTimeout(r, opts.pollEveryMs));
    const { body, ms } = await a.call<{ job: { status: string; message: string; result?: { batches?: number } } }>(
      "GET",
      `/api/jobs/${started.body.jobId}`,
      { cookie },
    );
    pollMs.push(ms);
    const { job } = body;
    const seconds = (performance.now() - t0) / 1000;
    if (job.status === "done" || job.status === "failed" || job.status === "cancelled") {
      return {
        status: job.status,
        message: job.message,
        seconds,
        batches: job.result?.batches ?? null,
        startMs: started.ms,
        pollMs,
        startedAt: t0,
        finishedAt: performance.now(),
      };
    }
    if (performance.now() - t0 > opts.giveUpAfterMs)
      return {
        status: "unfinished",
        message: job.message,
        seconds,
        batches: null,
        startMs: started.ms,
        pollMs,
        startedAt: t0,
        finishedAt: performance.now(),
      };
  }
}

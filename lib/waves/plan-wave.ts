import "server-only";
import type { JobDTO } from "@/lib/contracts/jobs";
import { defineJob, startJob } from "@/lib/jobs/server";
import { getWave, ordersOfWave } from "@/db/waves";
import { storePlan } from "@/db/batches";
import { audit } from "@/db/audit";
import { HttpError } from "@/lib/http/errors";
import { layoutGraph } from "@/lib/layout-versions/graph-cache";
import { WAVE_TIME_LIMIT_MS } from "@/lib/workers/pools";
import { TaskError } from "@/lib/workers/worker-pool";
import type { SignedInUser } from "@/lib/auth/session";
import { planOrders } from "./plan-orders";

function duration(ms: number): string {
  if (ms < 1000) return `${ms} ms`;
  if (ms < 120_000) return `${Math.round(ms / 1000)} seconds`;
  return `${Math.round(ms / 60_000)} minutes`;
}

/** What the planner reads on a failed job: what happened, that the wave is untouched, what to do next. */
function failureMessage(e: unknown): string {
  const unchanged = "The wave is unchanged and can be planned again.";
  if (e instanceof TaskError && e.reason === "timeout") {
    return `Planning failed: it took longer than the time limit of ${duration(WAVE_TIME_LIMIT_MS)} and was stopped. ${unchanged} Plan it again, or make a smaller wave (an earlier cut-off or fewer priorities).`;
  }
  if (e instanceof TaskError && e.reason === "crashed") {
    const memory = /memory/i.test(e.message) ? " because it ran out of memory" : "";
    return `Planning failed: the planning worker stopped unexpectedly${memory}. ${unchanged} Plan it again; if it fails again, make a smaller wave (an earlier cut-off or fewer priorities) or tell your admin.`;
  }
  return `Planning failed: ${(e as Error).message}`;
}

type PlanInput = { waveId: number; version: number };

export const planWaveJob = defineJob<PlanInput>("plan-wave", {
  access: { watch: "waves.read", cancel: "waves.plan" },
  messages: { start: "Loading orders and the layout", cancelled: "Planning was cancelled; the wave is as it was." },
  failureMessage,
  async run({ siteId, input: { waveId, version }, progress, signal, finish }) {
    const wave = await getWave(siteId, waveId);
    if (!wave) throw new Error("the wave was deleted");
    const [orders, { graph, matrix }] = await Promise.all([ordersOfWave(waveId), layoutGraph(wave.layoutVersionId)]);
    const s = wave.settings;
    const message = `Cutting ${orders.length} orders into batches and routing each (${s.method === "savings" ? "by route savings" : "first come by cut-off"})`;
    progress(0.02, message);
    const { stored, totals, unbatchable } = await planOrders({ graph, matrix }, orders, s, {
      signal,
      onProgress: (f) => progress(0.02 + f * 0.9, message),
    });
    progress(0.95, `Storing ${stored.length} batches`);
    const saved = totals.baselineMm > 0 ? Math.round((1 - totals.distanceMm / totals.baselineMm) * 1000) / 10 : 0;
    const done = {
      message: `Planned ${stored.length} batches; ${saved}% less walking than the usual order`,
      result: { waveId, batches: stored.length },
    };
    if (!(await storePlan(waveId, version, stored, totals, unbatchable, (trx) => finish(trx, done)))) {
      throw new Error("the wave changed while it was being planned (re-planned or released elsewhere); reload it");
    }
  },
});

/** Starts (or joins, for the same planner) planning the wave as it stands at `version`; the browser polls the job. */
export async function startPlanWave(user: SignedInUser, waveId: number, version: number, ip: string): Promise<JobDTO> {
  const wave = await getWave(user.siteId, waveId);
  if (!wave) throw new HttpError(404, "No such wave at this site.");
  if (wave.status === "released")
    throw new HttpError(409, "This wave is released; its batches are locked. Create a new wave for further orders.");
  if (wave.version !== version)
    throw new HttpError(409, "Someone changed this wave while you were looking. Reload it and plan again.");
  if (wave.orderCount === 0) throw new HttpError(422, "This wave has no orders to plan.");
  return startJob(
    planWaveJob,
    {
      siteId: user.siteId,
      key: `plan-wave:${waveId}@${version}`,
      userId: user.id,
      message: "Waiting to start",
      input: { waveId, version },
    },
    (by, j) =>
      j.status === "done"
        ? `${by} has just planned this wave. Reload it to see their batches.`
        : `${by} is planning this wave right now. Wait for their plan, then reload the wave to review it.`,
    (job) =>
      audit({
        event: "wave.plan_started",
        actorUserId: user.id,
        subject: `wave:${waveId}`,
        ip,
        detail: { version, job: job.id },
      }),
  );
}

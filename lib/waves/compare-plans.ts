import "server-only";
import { createHash } from "node:crypto";
import type { JobDTO } from "@/lib/contracts/jobs";
import type { WaveDTO, WaveSettings } from "@/lib/contracts/waves";
import type { PlanVariant } from "@/lib/contracts/wave-plans";
import type { WaveOrder } from "@/lib/batching/types";
import { defineJob, startJob } from "@/lib/jobs/server";
import { getWave, ordersOfWave } from "@/db/waves";
import { getSite } from "@/db/sites";
import { storePlan } from "@/db/batches";
import { getWavePlan, markPlanKept, storeWavePlans, waveOrderIds, type NewWavePlan } from "@/db/wave-plans";
import { audit } from "@/db/audit";
import { HttpError } from "@/lib/http/errors";
import { layoutGraph } from "@/lib/layout-versions/graph-cache";
import { siteTiming } from "@/lib/batching/estimate";
import { TaskError } from "@/lib/workers/worker-pool";
import type { SignedInUser } from "@/lib/auth/session";
import { kilograms } from "@/lib/format/units";
import { planOrders, type PlanSettings } from "./plan-orders";
import { perOrderTrips, summarisePlan } from "./plan-summary";

type CompareInput = { waveId: number; version: number; variants: PlanVariant[] };

/**
 * Order by order is the wave task with one tote per cart and no line or weight limit that could turn an
 * order away: each order is its own trip from depot to drop-off, its stops sequenced by the same
 * planner as any batch (exactly, up to the exact limit).
 */
const NO_LIMIT = 1_000_000_000;

export function variantLabel(v: PlanVariant): string {
  const method = v.method === "savings" ? "Route savings" : "First come by cut-off";
  return `${method}, ${v.totesPerCart} totes, ${v.maxLines} lines, ${kilograms(v.maxWeightG)}`;
}

function failureMessage(e: unknown): string {
  const unchanged = "The wave and its plan are unchanged.";
  if (e instanceof TaskError && e.reason === "timeout")
    return `Comparing plans failed: one of them took longer than the time limit and was stopped. ${unchanged} Compare fewer plans, or make the wave smaller.`;
  if (e instanceof TaskError && e.reason === "crashed")
    return `Comparing plans failed: the planning worker stopped unexpectedly. ${unchanged} Try again; if it fails again, make the wave smaller or tell your admin.`;
  return `Comparing plans failed: ${(e as Error).message}`;
}

export const comparePlansJob = defineJob<CompareInput>("compare-plans", {
  access: { watch: "waves.read", cancel: "waves.plan" },
  messages: { start: "Loading orders and the layout", cancelled: "Comparing was cancelled; no plans were stored." },
  failureMessage,
  async run({ job, siteId, userId, input: { waveId, version, variants }, progress, signal, finish }) {
    const wave = await getWave(siteId, waveId);
    if (!wave) throw new Error("the wave was deleted");
    const [orders, layout, site] = await Promise.all([
      ordersOfWave(waveId),
      layoutGraph(wave.layoutVersionId),
      getSite(siteId),
    ]);
    const timing = siteTiming(site);
    const ends = { depotId: wave.settings.depotId, dropoffId: wave.settings.dropoffId };
    const orderOfLine = new Map(orders.flatMap((o: WaveOrder) => o.lines.map((l) => [l.lineId, o.orderId] as const)));
    const steps = variants.length + 1;
    const share = (i: number, message: string) => (f: number) => progress(0.02 + ((i + f) / steps) * 0.93, message);

    const alone = `Routing ${orders.length} orders one per trip (order by order)`;
    progress(0.02, alone);
    const single = await planOrders(
      layout,
      orders,
      { method: "first-come", totesPerCart: 1, maxLines: NO_LIMIT, maxWeightG: NO_LIMIT, ...ends },
      { signal, onProgress: share(0, alone) },
    );
    const trips = perOrderTrips(single.stored, orderOfLine);

    const plans: NewWavePlan[] = [];
    for (const [i, v] of variants.entries()) {
      const label = variantLabel(v);
      const settings: WaveSettings = { ...v, ...ends };
      const message = `Plan ${i + 1} of ${variants.length}: ${label}`;
      progress(0.02 + ((i + 1) / steps) * 0.93, message);
      const planned = await planOrders(layout, orders, settings satisfies PlanSettings, {
        signal,
        onProgress: share(i + 1, message),
      });
      plans.push({
        label,
        settings,
        summary: summarisePlan(planned.stored, planned.unbatchable.length, trips, orderOfLine, timing),
        batches: planned.stored,
        unbatchable: planned.unbatchable,
        orderIds: orders.map((o) => o.orderId),
      });
    }
    progress(0.97, `Storing ${plans.length} plans`);
    await storeWavePlans(waveId, version, job.id, userId, plans, (trx) =>
      finish(trx, {
        message: `Compared ${plans.length} plans on the same ${orders.length} orders`,
        result: { waveId },
      }),
    );
  },
});

const variantKey = (variants: PlanVariant[]) =>
  createHash("sha256").update(JSON.stringify(variants)).digest("hex").slice(0, 16);

/** Starts (or joins, for the same planner asking again) computing these plans for the wave as it stands at `version`. */
export async function startComparePlans(
  user: SignedInUser,
  waveId: number,
  version: number,
  variants: PlanVariant[],
  ip: string,
): Promise<JobDTO> {
  const wave = await getWave(user.siteId, waveId);
  if (!wave) throw new HttpError(404, "No such wave at this site.");
  if (wave.status === "released")
    throw new HttpError(409, "This wave is released; its batches are locked, so there is no plan left to choose.");
  if (wave.version !== version)
    throw new HttpError(409, "Someone changed this wave while you were looking. Reload it and compare again.");
  if (wave.orderCount === 0) throw new HttpError(422, "This wave has no orders to plan.");
  const picked = variants.map((v) => ({
    method: v.method,
    totesPerCart: v.totesPerCart,
    maxLines: v.maxLines,
    maxWeightG: v.maxWeightG,
  }));
  const seen = new Set(picked.map((v) => JSON.stringify(v)));
  if (seen.size !== picked.length)
    throw new HttpError(422, "Two of the plans have the same method and cart limits; change one of them.");
  return startJob(
    comparePlansJob,
    {
      siteId: user.siteId,
      key: `compare-plans:${waveId}@${version}:${variantKey(picked)}`,
      userId: user.id,
      message: "Waiting to start",
      input: { waveId, version, variants: picked },
    },
    (by, j) =>
      j.status === "done"
        ? `${by} has just compared these plans for this wave. Reload the wave to see them.`
        : `${by} is comparing these plans for this wave right now. Wait for them, then reload the wave.`,
    (j) =>
      audit({
        event: "wave.plans_compared",
        actorUserId: user.id,
        subject: `wave:${waveId}`,
        ip,
        detail: { version, job: j.id, plans: picked.length },
      }),
  );
}

class OrdersChanged extends Error {}

const sameIds = (a: number[], b: number[]) => {
  const x = [...a].sort((p, q) => p - q);
  const y = [...b].sort((p, q) => p - q);
  return x.length === y.length && x.every((v, i) => v === y[i]);
};

/** The plan's batches become the wave's plan and its settings the wave's, if the wave is still as the plan saw it. */
export async function keepPlan(
  user: SignedInUser,
  waveId: number,
  planId: number,
  version: number,
  ip: string,
): Promise<WaveDTO> {
  const wave = await getWave(user.siteId, waveId);
  if (!wave) throw new HttpError(404, "No such wave at this site.");
  const plan = await getWavePlan(waveId, planId);
  if (!plan) throw new HttpError(404, "This wave has no such plan. Reload the wave to see its plans.");
  // The same planner's resend after it went through: the wave is still this plan, nothing to do.
  if (plan.keptVersion !== null && plan.keptVersion === wave.version && version === plan.keptVersion - 1) return wave;
  if (wave.status === "released")
    throw new HttpError(409, "This wave is released; its batches are locked and no other plan can be kept.");
  if (plan.waveVersion !== wave.version)
    throw new HttpError(
      409,
      "This plan was computed for an earlier state of the wave (its orders or settings changed, or it was planned again since). " +
        "Compare plans again to choose from plans for the wave as it stands.",
    );
  if (wave.version !== version)
    throw new HttpError(
      409,
      "The wave changed since you loaded it (another plan was kept, or it was edited or planned). Reload it and choose again.",
    );
  if (plan.settings.depotId !== wave.settings.depotId || plan.settings.dropoffId !== wave.settings.dropoffId)
    throw new HttpError(409, "The wave's depot or drop-off changed since this plan was computed. Compare plans again.");
  const totals = { distanceMm: plan.summary.distanceMm, baselineMm: plan.summary.usualWalkMm };
  let stored: boolean;
  try {
    stored = await storePlan(waveId, version, plan.batches, totals, plan.unbatchable, async (trx) => {
      if (!sameIds(await waveOrderIds(trx, waveId), plan.orderIds)) throw new OrdersChanged();
      await markPlanKept(trx, waveId, planId, plan.settings, version, version + 1);
    });
  } catch (e) {
    if (e instanceof OrdersChanged)
      throw new HttpError(
        409,
        "The wave's orders changed since this plan was computed. Compare plans again on the orders it holds now.",
      );
    throw e;
  }
  if (!stored)
    throw new HttpError(
      409,
      "Someone changed the wave a moment ago (kept another plan, re-planned, edited or released it). " +
        "Reload it to see what it holds now, then choose again.",
    );
  await audit({
    event: "wave.plan_kept",
    actorUserId: user.id,
    subject: `wave:${waveId}`,
    ip,
    detail: { plan: planId, version, label: plan.label },
  });
  return (await getWave(user.siteId, waveId)) as WaveDTO;
}

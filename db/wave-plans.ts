import "server-only";
import type { Knex } from "knex";
import { db } from "./knex";
import { iso, json } from "./rows";
import type { StoredBatch } from "@/lib/contracts/batches";
import type { UnbatchableOrder, WaveSettings } from "@/lib/contracts/waves";
import type { WavePlanDTO, WavePlanSummary } from "@/lib/contracts/wave-plans";

// Plans computed side by side for a wave (table wave_plans): stored by the comparison job, listed on
// the wave page, and one of them kept as the wave's plan.

export type NewWavePlan = {
  label: string;
  settings: WaveSettings;
  summary: WavePlanSummary;
  batches: StoredBatch[];
  unbatchable: UnbatchableOrder[];
  orderIds: number[];
};

/** A plan as stored: what was computed, with the wave and wave version it was computed for. */
export type StoredWavePlan = NewWavePlan & {
  id: number;
  waveId: number;
  waveVersion: number;
  keptVersion: number | null;
};

/** How many plans the wave page lists, newest first: enough for a few comparisons. */
const LISTED = 12;

/** Stores one comparison's plans; `beforeCommit` runs last in the transaction (the job marks itself done there). */
export async function storeWavePlans(
  waveId: number,
  waveVersion: number,
  jobId: string,
  userId: string | null,
  plans: NewWavePlan[],
  beforeCommit: (trx: Knex.Transaction) => Promise<void>,
): Promise<void> {
  await db().transaction(async (trx) => {
    for (const p of plans) await insertPlan(trx, p);
    await beforeCommit(trx);
  });
  async function insertPlan(trx: Knex.Transaction, p: NewWavePlan) {
    await trx("wave_plans").insert({
      wave_id: waveId,
      wave_version: waveVersion,
      job_id: jobId,
      label: p.label.slice(0, 200),
      settings: JSON.stringify(p.settings),
      summary: JSON.stringify(p.summary),
      batches: JSON.stringify(p.batches),
      unbatchable: JSON.stringify(p.unbatchable),
      order_ids: JSON.stringify(p.orderIds),
      created_by: userId,
    });
  }
}

/** The wave's latest plans, without their batches; `current` and `kept` are judged against the wave's version. */
export async function listWavePlans(
  waveId: number,
  wave: { version: number; released: boolean },
): Promise<WavePlanDTO[]> {
  const rows = await db()("wave_plans as p")
    .leftJoin("users as u", "u.id", "p.created_by")
    .where("p.wave_id", waveId)
    .orderBy("p.id", "desc")
    .limit(LISTED)
    .select(
      "p.id",
      "p.label",
      "p.settings",
      "p.summary",
      "p.wave_version",
      "p.kept_version",
      "p.created_at",
      "u.display_name",
    );
  return rows
    .reverse()
    .map(
      (r: {
        id: number;
        label: string;
        settings: unknown;
        summary: unknown;
        wave_version: number;
        kept_version: number | null;
        created_at: Date;
        display_name: string | null;
      }) => ({
        id: r.id,
        label: r.label,
        settings: json<WaveSettings>(r.settings),
        summary: json<WavePlanSummary>(r.summary),
        waveVersion: r.wave_version,
        current: r.wave_version === wave.version && !wave.released,
        kept: r.kept_version === wave.version,
        createdAt: iso(r.created_at) as string,
        createdBy: r.display_name,
      }),
    );
}

export async function getWavePlan(waveId: number, planId: number): Promise<StoredWavePlan | null> {
  const r = await db()("wave_plans").where({ id: planId, wave_id: waveId }).first();
  if (!r) return null;
  return {
    id: r.id,
    waveId: r.wave_id,
    waveVersion: r.wave_version,
    keptVersion: r.kept_version,
    label: r.label,
    settings: json<WaveSettings>(r.settings),
    summary: json<WavePlanSummary>(r.summary),
    batches: json<StoredBatch[]>(r.batches),
    unbatchable: json<UnbatchableOrder[]>(r.unbatchable),
    orderIds: json<number[]>(r.order_ids),
  };
}

/** The wave's order ids as they stand, read inside the keeping transaction (under the wave's row lock). */
export async function waveOrderIds(trx: Knex.Transaction, waveId: number): Promise<number[]> {
  return trx("wave_orders").where({ wave_id: waveId }).orderBy("order_id").pluck("order_id");
}

/**
 * After a plan was kept (wave at `fromVersion` → `toVersion`): the wave takes the plan's settings, the
 * plan is marked kept, and the wave's other plans of `fromVersion` move on with it, since keeping one
 * changes neither the orders nor the ends they were all computed on.
 */
export async function markPlanKept(
  trx: Knex.Transaction,
  waveId: number,
  planId: number,
  settings: WaveSettings,
  fromVersion: number,
  toVersion: number,
): Promise<void> {
  await trx("waves")
    .where({ id: waveId })
    .update({ settings: JSON.stringify(settings) });
  await trx("wave_plans").where({ wave_id: waveId, wave_version: fromVersion }).update({ wave_version: toVersion });
  await trx("wave_plans").where({ id: planId }).update({ kept_version: toVersion });
}

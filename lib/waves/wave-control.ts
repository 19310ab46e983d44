import "server-only";
import { getLayoutVersion } from "@/db/layout-versions";
import { getWave, OrdersTakenError, unclaimedOpenOrderIds } from "@/db/waves";
import {
  batchState,
  changeWaveOrders,
  editWave,
  orderRowsOf,
  ordersInWave,
  recallBatch,
  waveOrderIdsMatching,
} from "@/db/wave-control";
import { audit } from "@/db/audit";
import type { SignedInUser } from "@/lib/auth/session";
import type { WaveDTO, WaveSettings } from "@/lib/contracts/waves";
import { CANDIDATE_LIMIT, type WaveOrdersDTO } from "@/lib/contracts/wave-control";
import type { LayoutChoice } from "@/lib/contracts/layout-versions";
import { HttpError } from "@/lib/http/errors";
import { wentThrough } from "@/lib/http/repeat";

const noWave = () => new HttpError(404, "No such wave at this site. It may have been cancelled; check the waves list.");
const released = () =>
  new HttpError(
    409,
    "This wave is released: its batches are on the pickers' handhelds and it can no longer be edited. " +
      "Recall a batch nobody has started to send its orders back to open.",
  );
const stale = (what: string) =>
  new HttpError(
    409,
    `Someone changed this wave (its orders, settings or plan) since you loaded it. Reload the page, check it, then ${what} again.`,
  );

async function waveOf(user: SignedInUser, id: number): Promise<WaveDTO> {
  const wave = await getWave(user.siteId, id);
  if (!wave) throw noWave();
  return wave;
}

/** The depots and drop-offs of the wave's own layout version, for the editor's choices. */
export async function waveEnds(user: SignedInUser, wave: WaveDTO): Promise<Omit<LayoutChoice, "id" | "label">> {
  const full = await getLayoutVersion(user.siteId, wave.floorPlanId, wave.layoutVersionNumber);
  return {
    depots: full?.document.depots.map((d) => ({ id: d.id, name: d.name })) ?? [],
    dropoffs: full ? [...full.document.dropoffs, ...full.document.depots].map((d) => ({ id: d.id, name: d.name })) : [],
  };
}

export type WaveEdit = { version: number; name?: string; settings?: Partial<WaveSettings> };

/**
 * Renames a draft or planned wave, or changes its settings. New settings throw a planned wave's plan
 * away (its batches go, it is a draft again) so that "Save and re-plan" plans it afresh; a new name
 * keeps the plan.
 */
export async function editWaveBy(
  user: SignedInUser,
  id: number,
  input: WaveEdit,
  ip: string,
): Promise<{ wave: WaveDTO; planDropped: boolean }> {
  const before = await waveOf(user, id);
  const settings = input.settings ? { ...before.settings, ...input.settings } : undefined;
  if (settings) {
    const ends = await waveEnds(user, before);
    if (!ends.depots.some((d) => d.id === settings.depotId))
      throw new HttpError(400, `Layout version ${before.layoutVersionNumber} has no depot ${settings.depotId}.`);
    if (!ends.dropoffs.some((d) => d.id === settings.dropoffId))
      throw new HttpError(400, `Layout version ${before.layoutVersionNumber} has no drop-off ${settings.dropoffId}.`);
  }
  const r = await editWave(user.siteId, id, input.version, { name: input.name, settings });
  if (r.outcome === "missing") throw noWave();
  if (r.outcome === "released") throw released();
  if (r.outcome !== "edited") throw stale("save your changes");
  await audit({
    event: "wave.edited",
    actorUserId: user.id,
    subject: `wave:${id}`,
    ip,
    detail: {
      ...(input.name !== undefined ? { name: input.name.trim() } : {}),
      ...(settings ? { settings } : {}),
      planDropped: r.planDropped,
    },
  });
  return { wave: await waveOf(user, id), planDropped: r.planDropped };
}

export type OrderFilter = { cutoffBefore?: string; priorities?: number[]; includeNoCutoff?: boolean };
export type OrdersChange = {
  version: number;
  add?: number[];
  remove?: number[];
  addMatching?: OrderFilter;
  removeMatching?: OrderFilter;
};

const toFilter = (f: OrderFilter) => ({
  cutoffBefore: f.cutoffBefore ? new Date(f.cutoffBefore) : undefined,
  priorities: f.priorities,
  includeNoCutoff: f.includeNoCutoff,
});

const firstOf = (ns: string[]) =>
  ns.length <= 8 ? ns.join(", ") : `${ns.slice(0, 8).join(", ")} and ${ns.length - 8} more`;

/** Adds open orders to a draft or planned wave and takes orders out of it, by hand or by filter. */
export async function changeWaveOrdersBy(
  user: SignedInUser,
  id: number,
  input: OrdersChange,
  ip: string,
): Promise<{ wave: WaveDTO; added: number; removed: number; planDropped: boolean }> {
  const before = await waveOf(user, id);
  if (before.status === "released") throw released();
  const add = [...(input.add ?? [])];
  const remove = [...(input.remove ?? [])];
  if (input.addMatching) add.push(...(await unclaimedOpenOrderIds(user.siteId, toFilter(input.addMatching))));
  if (input.removeMatching) remove.push(...(await waveOrderIdsMatching(id, toFilter(input.removeMatching))));
  if (input.addMatching && !input.add?.length && add.length === 0)
    throw new HttpError(
      422,
      "No open order matches that filter: every matching order is already in a wave. Widen the cut-off or priorities.",
    );
  if (input.removeMatching && !input.remove?.length && remove.length === 0)
    throw new HttpError(422, "No order of this wave matches that filter; nothing was taken out.");
  try {
    const r = await changeWaveOrders(user.siteId, id, input.version, add, remove);
    if (r.outcome === "missing") throw noWave();
    if (r.outcome === "released") throw released();
    if (r.outcome !== "changed") throw stale("add or remove orders");
    if (r.added + r.removed > 0)
      await audit({
        event: "wave.orders_changed",
        actorUserId: user.id,
        subject: `wave:${id}`,
        ip,
        detail: { added: r.added, removed: r.removed, planDropped: r.planDropped },
      });
    return { wave: await waveOf(user, id), added: r.added, removed: r.removed, planDropped: r.planDropped };
  } catch (e) {
    if (e instanceof OrdersTakenError)
      throw new HttpError(
        409,
        `Nothing was changed: ${e.orderNumbers.length === 1 ? "order" : "orders"} ${firstOf(e.orderNumbers)} ${e.orderNumbers.length === 1 ? "is" : "are"} no longer open or already in another wave. Reload the list and choose again.`,
      );
    throw e;
  }
}

/** The wave's orders and the open orders that could join it. */
export async function waveOrders(user: SignedInUser, id: number): Promise<WaveOrdersDTO> {
  const wave = await waveOf(user, id);
  const [inWave, candidateIds] = await Promise.all([ordersInWave(wave.id), unclaimedOpenOrderIds(user.siteId, {})]);
  return {
    inWave,
    candidates: await orderRowsOf(user.siteId, candidateIds.slice(0, CANDIDATE_LIMIT)),
    candidateCount: candidateIds.length,
  };
}

/** A released batch nobody has started comes back from the floor; its orders are open again. */
export async function recallBatchBy(
  user: SignedInUser,
  waveId: number,
  number: number,
  version: number,
  ip: string,
): Promise<{ recalled: true; orders: string[] }> {
  await waveOf(user, waveId);
  const r = await recallBatch(user.siteId, waveId, number, version, user.id);
  if (r.outcome === "missing") throw new HttpError(404, `This wave has no batch ${number}. Reload the wave page.`);
  if (r.outcome === "recalled-already") {
    const now = await batchState(waveId, number);
    // The same planner's repeat (a double click, a resend) went through already.
    if (wentThrough(now, (b) => b.status === "recalled" && b.recalledBy === user.id, version))
      return { recalled: true, orders: [] };
    throw new HttpError(409, "This batch was already recalled by someone else; its orders are open again.");
  }
  if (r.outcome === "not-released")
    throw new HttpError(
      409,
      "This batch is not released, so there is nothing to recall. Edit the wave or cancel it instead.",
    );
  if (r.outcome === "started")
    throw new HttpError(
      409,
      r.status === "done"
        ? "This batch is already picked to the end; it cannot be recalled."
        : "This batch is already started (a line is confirmed): it cannot be recalled. Reassign it instead on the floor page.",
    );
  if (r.outcome !== "recalled")
    throw new HttpError(
      409,
      "This batch changed since you loaded the page (a picker took it or gave it back). Reload the wave and decide again.",
    );
  await audit({
    event: "batch.recalled",
    actorUserId: user.id,
    subject: `wave:${waveId}`,
    ip,
    detail: { batch: number, orders: r.orderNumbers.length, heldBy: r.heldBy },
  });
  return { recalled: true, orders: r.orderNumbers };
}

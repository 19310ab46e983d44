import "server-only";
import { getPickBatch, giveBackBatch, takeBatch, type PickBatchRow } from "@/db/picking";
import { getSite } from "@/db/sites";
import { audit } from "@/db/audit";
import type { SignedInUser } from "@/lib/auth/session";
import { HttpError } from "@/lib/http/errors";
import { wentThrough } from "@/lib/http/repeat";

async function batchAtSite(user: SignedInUser, id: number): Promise<PickBatchRow> {
  const batch = await getPickBatch(user.siteId, id);
  if (!batch) throw new HttpError(404, "No such batch at this site.");
  return batch;
}

const heldBy = (user: SignedInUser) => (b: PickBatchRow) => b.assignedTo === user.id;

/** A picker takes a released batch onto their handheld, up to the site's cap of unfinished batches. */
export async function takeBatchFor(user: SignedInUser, id: number, version: number, ip: string): Promise<PickBatchRow> {
  const site = await getSite(user.siteId);
  const cap = site?.maxOpenBatchesPerPicker ?? 3;
  const before = await batchAtSite(user, id);
  if (wentThrough(before, (b) => heldBy(user)(b) && b.status !== "done")) return before;
  const outcome = await takeBatch(user.siteId, id, version, user.id, cap);
  const batch = (await getPickBatch(user.siteId, id))!;
  if (outcome === "cap")
    throw new HttpError(
      409,
      `You already hold ${cap} unfinished batch${cap === 1 ? "" : "es"}, the most this site allows. Finish one or give one back first.`,
    );
  if (outcome === "lost") {
    if (wentThrough(batch, heldBy(user))) return batch;
    if (batch.status === "planned") throw new HttpError(409, "This batch is not released yet.");
    if (batch.status === "recalled")
      throw new HttpError(409, "This batch was recalled by the planner. Take the next one.");
    if (batch.status === "done")
      throw new HttpError(409, "This batch is already picked to the end. Take the next one.");
    if (batch.assignedTo) throw new HttpError(409, "Someone else took this batch first. Take the next one.");
    throw new HttpError(
      409,
      "This batch was given back or changed since you loaded the list. Reload and take it again.",
    );
  }
  await audit({ event: "batch.taken", actorUserId: user.id, subject: `batch:${id}`, ip });
  return batch;
}

/** The holder (or an admin) puts an unfinished batch back in the pool for the next picker. */
export async function giveBackBatchOf(
  user: SignedInUser,
  id: number,
  version: number,
  ip: string,
  subject: string,
): Promise<PickBatchRow> {
  const anyHolder = user.role === "admin";
  const before = await batchAtSite(user, id);
  if (wentThrough(before, (b) => b.assignedTo === null, version)) return before;
  if (!anyHolder && before.assignedTo !== user.id) {
    await audit({
      event: "access.denied",
      actorUserId: user.id,
      subject,
      ip,
      detail: { batchId: id, assignedTo: before.assignedTo },
    });
    throw new HttpError(403, "This batch is not on your handheld, so you cannot give it back.");
  }
  if (before.status === "done")
    throw new HttpError(409, "This batch is picked to the end; there is nothing to give back.");
  if (before.status === "planned") throw new HttpError(409, "This batch is not released yet, so nobody holds it.");
  if (!before.assignedTo) throw new HttpError(409, "Nobody holds this batch: it is already waiting to be taken.");
  if (!(await giveBackBatch(user.siteId, id, version, user.id, anyHolder)))
    throw new HttpError(409, "This batch changed since you loaded it. Reload and try again.");
  await audit({
    event: "batch.given-back",
    actorUserId: user.id,
    subject: `batch:${id}`,
    ip,
    detail: { from: before.assignedTo },
  });
  return (await getPickBatch(user.siteId, id))!;
}

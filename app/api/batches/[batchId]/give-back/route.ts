import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { intParam } from "@/lib/http/params";
import { rowVersion } from "@/lib/http/body-fields";
import { getPickBatch, giveBackBatch } from "@/db/picking";
import { audit } from "@/db/audit";

const GiveBack = z.object({ version: rowVersion() });

/** The holder (or an admin) puts an unfinished batch back in the pool for the next picker. */
export const POST = route({ access: "picks.work", body: GiveBack }, async ({ user, params, body, ip, req }) => {
  const id = intParam(params, "batchId", "batch");
  const anyHolder = user.role === "admin";
  const before = await getPickBatch(user.siteId, id);
  if (!before) throw new HttpError(404, "No such batch at this site.");
  // A repeat of a give-back that went through finds the batch unheld, one version on.
  if (before.assignedTo === null && before.version === body.version + 1) return Response.json({ batch: before });
  if (!anyHolder && before.assignedTo !== user.id) {
    await audit({ event: "access.denied", actorUserId: user.id, subject: `POST ${new URL(req.url).pathname}`, ip, detail: { batchId: id, assignedTo: before.assignedTo } });
    throw new HttpError(403, "This batch is not on your handheld, so you cannot give it back.");
  }
  if (before.status === "done") throw new HttpError(409, "This batch is picked to the end; there is nothing to give back.");
  if (before.status === "planned") throw new HttpError(409, "This batch is not released yet, so nobody holds it.");
  if (!before.assignedTo) throw new HttpError(409, "Nobody holds this batch: it is already waiting to be taken.");
  if (!(await giveBackBatch(user.siteId, id, body.version, user.id, anyHolder))) throw new HttpError(409, "This batch changed since you loaded it. Reload and try again.");
  await audit({ event: "batch.given-back", actorUserId: user.id, subject: `batch:${id}`, ip, detail: { from: before.assignedTo } });
  return Response.json({ batch: await getPickBatch(user.siteId, id) });
});

import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { intParam } from "@/lib/http/params";
import { rowVersion } from "@/lib/http/body-fields";
import { getPickBatch, takeBatch } from "@/db/picking";
import { getSite } from "@/db/sites";
import { audit } from "@/db/audit";

const Take = z.object({ version: rowVersion() });

export const POST = route({ access: "picks.work", body: Take }, async ({ user, params, body, ip }) => {
  const id = intParam(params, "batchId", "batch");
  const site = await getSite(user.siteId);
  const cap = site?.maxOpenBatchesPerPicker ?? 3;
  const before = await getPickBatch(user.siteId, id);
  if (!before) throw new HttpError(404, "No such batch at this site.");
  // A retry of a take that went through is not an error.
  if (before.assignedTo === user.id && before.status !== "done") return Response.json({ batch: before });
  const outcome = await takeBatch(user.siteId, id, body.version, user.id, cap);
  const batch = (await getPickBatch(user.siteId, id))!;
  if (outcome === "cap") throw new HttpError(409, `You already hold ${cap} unfinished batch${cap === 1 ? "" : "es"}, the most this site allows. Finish one or give one back first.`);
  if (outcome === "lost") {
    if (batch.assignedTo === user.id) return Response.json({ batch });
    if (batch.status === "planned") throw new HttpError(409, "This batch is not released yet.");
    if (batch.status === "done") throw new HttpError(409, "This batch is already picked to the end. Take the next one.");
    if (batch.assignedTo) throw new HttpError(409, "Someone else took this batch first. Take the next one.");
    throw new HttpError(409, "This batch was given back or changed since you loaded the list. Reload and take it again.");
  }
  await audit({ event: "batch.taken", actorUserId: user.id, subject: `batch:${id}`, ip });
  return Response.json({ batch });
});

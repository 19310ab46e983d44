import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { intParam } from "@/lib/http/params";
import { rowVersion } from "@/lib/http/body-fields";
import { getPickBatch, takeBatch } from "@/db/picking";
import { audit } from "@/db/audit";

const Take = z.object({ version: rowVersion() });

export const POST = route({ access: "picks.work", body: Take }, async ({ user, params, body, ip }) => {
  const id = intParam(params, "batchId", "batch");
  const won = await takeBatch(user.siteId, id, body.version, user.id);
  const batch = await getPickBatch(user.siteId, id);
  if (!batch) throw new HttpError(404, "No such batch at this site.");
  if (!won) {
    // A retry of a take that went through is not an error.
    if (batch.assignedTo === user.id && batch.version === body.version + 1) return Response.json({ batch });
    if (batch.status === "planned") throw new HttpError(409, "This batch is not released yet.");
    if (batch.assignedTo) throw new HttpError(409, "Someone else took this batch first. Take the next one.");
    throw new HttpError(409, "This batch changed since you loaded the list. Reload and try again.");
  }
  await audit({ event: "batch.taken", actorUserId: user.id, subject: `batch:${id}`, ip });
  return Response.json({ batch });
});

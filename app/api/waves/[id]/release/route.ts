import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { intParam } from "@/lib/http/params";
import { rowVersion } from "@/lib/http/body-fields";
import { getWave, releaseWave } from "@/db/waves";
import { audit } from "@/db/audit";
import { appOrigin } from "@/lib/mail/config";

const Release = z.object({ version: rowVersion() });

export const POST = route({ access: "waves.plan", body: Release }, async ({ user, params, body, ip }) => {
  const id = intParam(params, "id", "wave");
  const outcome = await releaseWave(user.siteId, id, body.version, user.id, appOrigin());
  const wave = await getWave(user.siteId, id);
  if (!wave) throw new HttpError(404, "No such wave at this site.");
  if (outcome === "not-planned") throw new HttpError(409, "Plan the wave before releasing it.");
  if (outcome === "stale") {
    // The same planner's retry after a release that went through is not an error; anyone else's is.
    if (wave.status === "released" && wave.version === body.version + 1 && wave.releasedBy === user.id) return Response.json({ wave });
    throw new HttpError(409, wave.status === "released" ? "This wave was already released by someone else." : "The wave changed (re-planned?) since you loaded it. Reload and check the batches, then release.");
  }
  await audit({ event: "wave.released", actorUserId: user.id, subject: `wave:${id}`, ip, detail: { batches: wave.batchCount } });
  return Response.json({ wave });
});

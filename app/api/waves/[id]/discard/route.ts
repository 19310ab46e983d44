import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { intParam } from "@/lib/http/params";
import { rowVersion } from "@/lib/http/body-fields";
import { discardWave } from "@/db/waves";
import { audit } from "@/db/audit";

const Discard = z.object({ version: rowVersion() });

export const POST = route({ access: "waves.plan", body: Discard }, async ({ user, params, body, ip }) => {
  const id = intParam(params, "id", "wave");
  const r = await discardWave(user.siteId, id, body.version);
  if (r.outcome === "missing") throw new HttpError(404, "No such wave at this site: it may have been discarded already. Its orders are then open again on the orders page.");
  if (r.outcome === "released") throw new HttpError(409, "This wave is released: its batches are on the pickers' handhelds and it cannot be discarded.");
  if (r.outcome !== "discarded") throw new HttpError(409, "The wave changed (re-planned?) since you loaded it. Reload it and decide again.");
  await audit({ event: "wave.discarded", actorUserId: user.id, subject: `wave:${id}`, ip, detail: { orders: r.orders } });
  return Response.json({ discarded: true, orders: r.orders });
});

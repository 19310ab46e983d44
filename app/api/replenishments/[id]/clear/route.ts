import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { idParam } from "@/lib/http/params";
import { rowVersion } from "@/lib/http/body-fields";
import { clearReplenishment } from "@/db/short-picks";

export const POST = route(
  {
    access: "shortpicks.follow",
    params: z.object({ id: idParam("replenishment flag") }),
    body: z.object({ version: rowVersion() }),
  },
  async ({ user, params, body, ip }) => {
    const outcome = await clearReplenishment(user.siteId, params.id, body.version, user.id, ip);
    if (outcome.kind === "missing")
      throw new HttpError(404, "No such replenishment flag at this site. Reload the list.");
    if (outcome.kind === "refused") throw new HttpError(409, outcome.message);
    return Response.json(
      { cleared: true },
      { headers: outcome.kind === "replay" ? { "idempotent-replayed": "true" } : {} },
    );
  },
);

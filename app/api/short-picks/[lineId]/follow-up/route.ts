import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { idParam } from "@/lib/http/params";
import { rowVersion } from "@/lib/http/body-fields";
import { followUpShortPick } from "@/db/short-picks";
import { FOLLOW_UP_ACTIONS } from "@/lib/contracts/short-picks";

const FollowUp = z.object({
  action: z.enum(FOLLOW_UP_ACTIONS, { error: "Choose re-pick later, cancel the line or flag the bin." }),
  // The line's follow-up version the list showed.
  version: rowVersion(),
});

export const POST = route(
  { access: "shortpicks.follow", params: z.object({ lineId: idParam("short pick") }), body: FollowUp },
  async ({ user, params, body, ip }) => {
    const outcome = await followUpShortPick(user.siteId, params.lineId, body.action, body.version, user.id, ip);
    if (outcome.kind === "missing") throw new HttpError(404, "No such short pick at this site. Reload the list.");
    if (outcome.kind === "refused") throw new HttpError(409, outcome.message);
    return Response.json(
      { shortPick: outcome.row },
      { headers: outcome.kind === "replay" ? { "idempotent-replayed": "true" } : {} },
    );
  },
);

import { z } from "zod";
import { route } from "@/lib/http/route";
import { idParam } from "@/lib/http/params";
import { rowVersion } from "@/lib/http/body-fields";
import { keepPlan } from "@/lib/waves/compare-plans";

const Keep = z.object({ version: rowVersion() });

export const POST = route(
  { access: "waves.plan", params: z.object({ id: idParam("wave"), planId: idParam("plan") }), body: Keep },
  async ({ user, params, body, ip }) =>
    Response.json({ wave: await keepPlan(user, params.id, params.planId, body.version, ip) }),
);

import { z } from "zod";
import { route } from "@/lib/http/route";
import { idParam } from "@/lib/http/params";
import { RecallBody } from "@/lib/waves/control-schemas";
import { recallBatchBy } from "@/lib/waves/wave-control";

export const POST = route(
  { access: "waves.plan", params: z.object({ id: idParam("wave"), number: idParam("batch") }), body: RecallBody },
  async ({ user, params, body, ip }) =>
    Response.json(await recallBatchBy(user, params.id, params.number, body.version, ip)),
);

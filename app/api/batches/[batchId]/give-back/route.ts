import { z } from "zod";
import { route } from "@/lib/http/route";
import { idParam } from "@/lib/http/params";
import { rowVersion } from "@/lib/http/body-fields";
import { giveBackBatchOf } from "@/lib/picking/hold-batch";

const GiveBack = z.object({ version: rowVersion() });

export const POST = route(
  { access: "picks.work", params: z.object({ batchId: idParam("batch") }), body: GiveBack },
  async ({ user, params, body, ip, req }) =>
    Response.json({
      batch: await giveBackBatchOf(user, params.batchId, body.version, ip, `POST ${new URL(req.url).pathname}`),
    }),
);

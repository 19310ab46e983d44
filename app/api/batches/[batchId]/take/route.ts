import { z } from "zod";
import { route } from "@/lib/http/route";
import { idParam } from "@/lib/http/params";
import { rowVersion } from "@/lib/http/body-fields";
import { takeBatchFor } from "@/lib/picking/hold-batch";

const Take = z.object({ version: rowVersion() });

export const POST = route(
  { access: "picks.work", params: z.object({ batchId: idParam("batch") }), body: Take },
  async ({ user, params, body, ip }) =>
    Response.json({ batch: await takeBatchFor(user, params.batchId, body.version, ip) }),
);

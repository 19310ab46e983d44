import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { idParam } from "@/lib/http/params";
import { rowId, rowVersion } from "@/lib/http/body-fields";
import { workableBatch } from "@/lib/picking/access";
import { confirmPick } from "@/lib/picking/confirm";
import { SHORT_REASONS } from "@/lib/picking/rules";

const Confirm = z.object({
  idempotencyKey: z.string().trim().min(8).max(64),
  orderLineId: rowId("order line"),
  scan: z.string().max(100).optional(),
  quantity: z.number().int().min(0).max(1_000_000),
  short: z.object({ reason: z.enum(SHORT_REASONS) }).optional(),
  // What the screen showed, so a tap can only confirm the line the picker saw.
  binCode: z.string().trim().min(1, "Say which bin your screen showed for this line. Reload the batch.").max(100),
  batchVersion: rowVersion(),
});

export const POST = route(
  { access: "picks.work", params: z.object({ batchId: idParam("batch") }), body: Confirm },
  async ({ user, params, body, ip, req }) => {
    const id = params.batchId;
    await workableBatch(user, id, ip, `POST ${new URL(req.url).pathname}`);
    const outcome = await confirmPick(id, user.id, body, ip);
    if (outcome.kind === "mismatch")
      throw new HttpError(409, "This confirmation key was already used for a different pick. Confirm again.");
    // A repeat gets the stored answer unchanged; only a header says it is one.
    return Response.json(outcome.answer.body, {
      status: outcome.answer.status,
      headers: outcome.kind === "replay" ? { "idempotent-replayed": "true" } : {},
    });
  },
);

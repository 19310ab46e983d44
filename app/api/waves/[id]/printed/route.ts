import { z } from "zod";
import { route } from "@/lib/http/route";
import { idParam } from "@/lib/http/params";
import { recordPrintedBy } from "@/lib/waves/wave-actions";

const Printed = z.object({
  numbers: z
    .array(z.number().int().positive().max(10_000, "No wave has that many batches."))
    .min(1, "Say which batches were printed.")
    .max(2000),
});

export const POST = route(
  { access: "waves.plan", params: z.object({ id: idParam("wave") }), body: Printed },
  async ({ user, params, body, ip }) => Response.json(await recordPrintedBy(user, params.id, body.numbers, ip)),
);

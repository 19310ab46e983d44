import { z } from "zod";
import { route } from "@/lib/http/route";
import { idParam } from "@/lib/http/params";
import { rowVersion } from "@/lib/http/body-fields";
import { assignBatchBy } from "@/lib/shift/assign";

const Assign = z.object({
  // A user id from the floor's list of pickers; null takes the batch back into the pool.
  pickerId: z
    .string("Choose a picker from the list, or take the batch back.")
    .trim()
    .min(1, "Choose a picker from the list, or take the batch back.")
    .max(32, "Choose a picker from the list: that is not a picker's id.")
    .nullable(),
  version: rowVersion(),
});

export const POST = route(
  { access: "batches.assign", params: z.object({ batchId: idParam("batch") }), body: Assign },
  async ({ user, params, body, ip }) =>
    Response.json(await assignBatchBy(user, params.batchId, body.version, body.pickerId, ip)),
);

import { z } from "zod";
import { route } from "@/lib/http/route";
import { idParam } from "@/lib/http/params";
import { workableBatch } from "@/lib/picking/access";
import { pickView } from "@/lib/picking/view";

export const GET = route(
  { access: "picks.work", params: z.object({ batchId: idParam("batch") }) },
  async ({ user, params, ip, req }) => {
    const batch = await workableBatch(user, params.batchId, ip, `GET ${new URL(req.url).pathname}`);
    return Response.json((await pickView(user.siteId, batch)).view);
  },
);

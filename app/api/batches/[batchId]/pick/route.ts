import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { intParam } from "@/lib/http/params";
import { mayWorkBatch } from "@/lib/picking/access";
import { pickView } from "@/lib/picking/view";

export const GET = route({ access: "picks.work" }, async ({ user, params, ip, req }) => {
  const id = intParam(params, "batchId", "batch");
  const access = await mayWorkBatch(user, id, ip, `GET ${new URL(req.url).pathname}`);
  if (!access.ok) throw new HttpError(access.status, access.message);
  const { view } = await pickView(user.siteId, access.batch);
  return Response.json(view);
});

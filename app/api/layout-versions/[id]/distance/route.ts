import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { intParam } from "@/lib/http/params";
import { layoutDistance } from "@/lib/layout-versions/distance";

export const dynamic = "force-dynamic";

export const GET = route({ access: "floorplans.read" }, async ({ user, params, req }) => {
  const url = new URL(req.url);
  const from = url.searchParams.get("from")?.trim() ?? "";
  const to = url.searchParams.get("to")?.trim() ?? "";
  if (!from || !to) throw new HttpError(400, "Give two location codes: ?from=…&to=…");
  return Response.json(await layoutDistance(user.siteId, intParam(params, "id", "layout version"), from, to));
});

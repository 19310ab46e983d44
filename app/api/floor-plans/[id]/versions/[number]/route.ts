import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { intParam } from "@/lib/http/params";
import { getLayoutVersion, listLayoutBins } from "@/db/layout-versions";

export const dynamic = "force-dynamic";

export const GET = route({ access: "floorplans.read" }, async ({ user, params }) => {
  const version = await getLayoutVersion(user.siteId, intParam(params, "id", "floor plan"), intParam(params, "number", "layout version"));
  if (!version) throw new HttpError(404, "No such layout version. It may not be published yet.");
  return Response.json({ version, bins: await listLayoutBins(version.id) });
});

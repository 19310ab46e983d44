import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { idParam } from "@/lib/http/params";
import { getLayoutVersion, listLayoutBins } from "@/db/layout-versions";

export const GET = route(
  { access: "floorplans.read", params: z.object({ id: idParam("floor plan"), number: idParam("layout version") }) },
  async ({ user, params }) => {
    const version = await getLayoutVersion(user.siteId, params.id, params.number);
    if (!version) throw new HttpError(404, "No such layout version. It may not be published yet.");
    return Response.json({ version, bins: await listLayoutBins(version.id) });
  },
);

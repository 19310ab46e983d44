import { route } from "@/lib/http/route";
import { intParam } from "@/lib/http/params";
import { listLayoutVersions } from "@/db/layout-versions";

export const dynamic = "force-dynamic";

export const GET = route({ access: "floorplans.read" }, async ({ user, params }) =>
  Response.json({ versions: await listLayoutVersions(user.siteId, intParam(params, "id", "floor plan")) }),
);

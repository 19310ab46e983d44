import { z } from "zod";
import { route } from "@/lib/http/route";
import { idParam } from "@/lib/http/params";
import { listLayoutVersions } from "@/db/layout-versions";

export const GET = route(
  { access: "floorplans.read", params: z.object({ id: idParam("floor plan") }) },
  async ({ user, params }) => Response.json({ versions: await listLayoutVersions(user.siteId, params.id) }),
);

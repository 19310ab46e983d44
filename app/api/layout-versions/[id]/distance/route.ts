import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { idParam } from "@/lib/http/params";
import { layoutDistance } from "@/lib/layout-versions/distance";

export const GET = route(
  { access: "floorplans.read", params: z.object({ id: idParam("layout version") }) },
  async ({ user, params, req }) => {
    const url = new URL(req.url);
    const from = url.searchParams.get("from")?.trim() ?? "";
    const to = url.searchParams.get("to")?.trim() ?? "";
    if (!from || !to) throw new HttpError(400, "Give two location codes: ?from=…&to=…");
    return Response.json(await layoutDistance(user.siteId, params.id, from, to));
  },
);

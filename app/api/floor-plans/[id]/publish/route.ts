import { z } from "zod";
import { route } from "@/lib/http/route";
import { idParam } from "@/lib/http/params";
import { rowVersion } from "@/lib/http/body-fields";
import { startPublish } from "@/lib/layout-versions/publish";

const Publish = z.object({ version: rowVersion() });

export const POST = route(
  { access: "floorplans.edit", params: z.object({ id: idParam("floor plan") }), body: Publish },
  async ({ user, params, body, ip }) => {
    const job = await startPublish(user, params.id, body.version, ip);
    return Response.json({ jobId: job.id, job }, { status: 202 });
  },
);

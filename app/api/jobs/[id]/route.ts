import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { stringParam } from "@/lib/http/params";
import { getJob } from "@/db/jobs";
import { roleMay, type Permission } from "@/lib/auth/permissions";

export const dynamic = "force-dynamic";

// Who may watch a job follows what the job works on.
const KIND_ACCESS: Record<string, Permission> = { "publish-layout": "floorplans.read" };

export const GET = route({ access: "signed-in" }, async ({ user, params }) => {
  const job = await getJob(user.siteId, stringParam(params, "id"));
  const access = job ? KIND_ACCESS[job.kind] : undefined;
  if (!job || !access || !roleMay(user.role, access)) throw new HttpError(404, "No such job. It may belong to another site or have been cleared.");
  return Response.json({ job });
});

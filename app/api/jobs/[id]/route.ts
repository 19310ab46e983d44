import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { stringParam } from "@/lib/http/params";
import { getJob, updateJob } from "@/db/jobs";
import { cancelJob } from "@/lib/jobs/cancel";
import type { SignedInUser } from "@/lib/auth/session";
import { roleMay, type Permission } from "@/lib/auth/permissions";

export const dynamic = "force-dynamic";

// Who may watch or stop a job follows what the job works on.
const KIND_ACCESS: Record<string, { watch: Permission; cancel: Permission }> = {
  "publish-layout": { watch: "floorplans.read", cancel: "floorplans.edit" },
  "plan-wave": { watch: "waves.read", cancel: "waves.plan" },
};

async function jobFor(user: SignedInUser, id: string, need: "watch" | "cancel") {
  const job = await getJob(user.siteId, id);
  const access = job ? KIND_ACCESS[job.kind] : undefined;
  if (!job || !access || !roleMay(user.role, access.watch)) throw new HttpError(404, "No such job. It may belong to another site or have been cleared.");
  if (!roleMay(user.role, access[need])) throw new HttpError(403, "Your role may watch this job but not stop it.");
  return job;
}

export const GET = route({ access: "signed-in" }, async ({ user, params }) => Response.json({ job: await jobFor(user, stringParam(params, "id"), "watch") }));

export const DELETE = route({ access: "signed-in" }, async ({ user, params }) => {
  const job = await jobFor(user, stringParam(params, "id"), "cancel");
  if (job.status === "done" || job.status === "failed" || job.status === "cancelled") return Response.json({ job });
  if (!cancelJob(job.id)) {
    // Not running in this process (the server restarted): nothing can finish it, so say so.
    await updateJob(job.id, { status: "cancelled", message: "Cancelled." });
  }
  return Response.json({ job: await getJob(user.siteId, job.id) }, { status: 202 });
});

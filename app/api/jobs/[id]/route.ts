import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { stringParam } from "@/lib/http/params";
import { getJob, updateJob } from "@/db/jobs";
import { stopWork } from "@/lib/jobs/cancel";
import type { SignedInUser } from "@/lib/auth/session";
import { roleMay, type Permission } from "@/lib/auth/permissions";

export const dynamic = "force-dynamic";

// Who may watch or stop a job follows what the job works on.
const KIND_ACCESS: Record<string, { watch: Permission; cancel: Permission; cancelled: string }> = {
  "publish-layout": { watch: "floorplans.read", cancel: "floorplans.edit", cancelled: "Publishing was cancelled; no new layout version was made." },
  "plan-wave": { watch: "waves.read", cancel: "waves.plan", cancelled: "Planning was cancelled; the wave is as it was." },
};

async function jobFor(user: SignedInUser, id: string, need: "watch" | "cancel") {
  const job = await getJob(user.siteId, id);
  const access = job ? KIND_ACCESS[job.kind] : undefined;
  if (!job || !access || !roleMay(user.role, access.watch)) throw new HttpError(404, "No such job. It may belong to another site or have been cleared.");
  if (!roleMay(user.role, access[need])) throw new HttpError(403, "Your role may watch this job but not stop it.");
  return { job, access };
}

export const GET = route({ access: "signed-in" }, async ({ user, params }) => Response.json({ job: (await jobFor(user, stringParam(params, "id"), "watch")).job }));

// 202 only when this request stopped the job: the row changes only while the job is live, and the
// job's own finish commits only while it still says running, so exactly one of the two wins.
export const DELETE = route({ access: "signed-in" }, async ({ user, params }) => {
  const { job, access } = await jobFor(user, stringParam(params, "id"), "cancel");
  if (await updateJob(job.id, { status: "cancelled", message: access.cancelled })) {
    stopWork(job.id);
    return Response.json({ job: await getJob(user.siteId, job.id) }, { status: 202 });
  }
  const now = (await getJob(user.siteId, job.id)) ?? job;
  // A repeated cancel (a double click) answers like the first did.
  if (now.status === "cancelled") return Response.json({ job: now });
  const message =
    now.status === "done"
      ? `This job has already finished (${now.message}), so there is nothing to cancel. Reload the page to see the result.`
      : `This job has already finished: it failed (${now.message}). There is nothing to cancel.`;
  throw new HttpError(409, message, { job: now });
});

import { route } from "@/lib/http/route";
import { stringParam } from "@/lib/http/params";
import "@/lib/jobs/kinds";
import { cancelJob, watchJob } from "@/lib/jobs/server";

export const dynamic = "force-dynamic";

export const GET = route({ access: "signed-in" }, async ({ user, params }) => Response.json({ job: await watchJob(user, stringParam(params, "id")) }));

// 202 only when this request stopped the job; a repeated cancel answers 200 like the first did.
export const DELETE = route({ access: "signed-in" }, async ({ user, params }) => {
  const { job, stopped } = await cancelJob(user, stringParam(params, "id"));
  return Response.json({ job }, { status: stopped ? 202 : 200 });
});

import { route } from "@/lib/http/route";
import { z } from "zod";
import { textParam } from "@/lib/http/params";
import "@/lib/jobs/kinds";
import { cancelJob, watchJob } from "@/lib/jobs/server";

const JobParams = z.object({ id: textParam() });

export const GET = route({ access: "signed-in", params: JobParams }, async ({ user, params }) =>
  Response.json({ job: await watchJob(user, params.id) }),
);

// 202 only when this request stopped the job; a repeated cancel answers 200 like the first did.
export const DELETE = route({ access: "signed-in", params: JobParams }, async ({ user, params }) => {
  const { job, stopped } = await cancelJob(user, params.id);
  return Response.json({ job }, { status: stopped ? 202 : 200 });
});

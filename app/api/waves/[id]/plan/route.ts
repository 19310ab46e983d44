import { z } from "zod";
import { route } from "@/lib/http/route";
import { idParam } from "@/lib/http/params";
import { rowVersion } from "@/lib/http/body-fields";
import { startPlanWave } from "@/lib/waves/plan-wave";

const Plan = z.object({ version: rowVersion() });

export const POST = route(
  { access: "waves.plan", params: z.object({ id: idParam("wave") }), body: Plan },
  async ({ user, params, body, ip }) => {
    const job = await startPlanWave(user, params.id, body.version, ip);
    return Response.json({ jobId: job.id, job }, { status: 202 });
  },
);

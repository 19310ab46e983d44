import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { idParam } from "@/lib/http/params";
import { rowVersion } from "@/lib/http/body-fields";
import { getWave } from "@/db/waves";
import { listWavePlans } from "@/db/wave-plans";
import { MAX_PLAN_VARIANTS, type WavePlansDTO } from "@/lib/contracts/wave-plans";
import { startComparePlans } from "@/lib/waves/compare-plans";

// The same bounds as a new wave's cart settings (app/api/waves/route.ts).
const Variant = z.object({
  method: z.enum(["first-come", "savings"]),
  totesPerCart: z.number().int().min(1, "A cart carries at least one tote.").max(40),
  maxLines: z.number().int().min(1, "A cart takes at least one line.").max(500),
  maxWeightG: z.number().int().min(1000, "Allow at least 1 kg per cart.").max(1_000_000),
});

const Compare = z.object({
  version: rowVersion(),
  variants: z
    .array(Variant)
    .min(2, "Choose at least two plans to compare.")
    .max(MAX_PLAN_VARIANTS, `Compare at most ${MAX_PLAN_VARIANTS} plans at once.`),
});

const params = z.object({ id: idParam("wave") });

export const GET = route({ access: "waves.read", params }, async ({ user, params }) => {
  const wave = await getWave(user.siteId, params.id);
  if (!wave) throw new HttpError(404, "No such wave at this site.");
  const plans = await listWavePlans(wave.id, { version: wave.version, released: wave.status === "released" });
  const body: WavePlansDTO = { wave: { id: wave.id, version: wave.version, status: wave.status }, plans };
  return Response.json(body);
});

export const POST = route({ access: "waves.plan", params, body: Compare }, async ({ user, params, body, ip }) => {
  const job = await startComparePlans(user, params.id, body.version, body.variants, ip);
  return Response.json({ jobId: job.id, job }, { status: 202 });
});

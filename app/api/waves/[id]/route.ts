import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { idParam } from "@/lib/http/params";
import { getWave } from "@/db/waves";
import { listBatches } from "@/db/batches";
import { shortPicksOfWave } from "@/db/short-picks";
import { WaveEditBody } from "@/lib/waves/control-schemas";
import { editWaveBy } from "@/lib/waves/wave-control";

export const GET = route(
  { access: "waves.read", params: z.object({ id: idParam("wave") }) },
  async ({ user, params }) => {
    const wave = await getWave(user.siteId, params.id);
    if (!wave) throw new HttpError(404, "No such wave at this site.");
    const [batches, shortPicks] = await Promise.all([listBatches(wave.id), shortPicksOfWave(wave.id)]);
    return Response.json({ wave, batches, shortPicks });
  },
);

/** Edits a draft or planned wave: its name, or its settings (which throw a planned wave's plan away). */
export const PATCH = route(
  { access: "waves.plan", params: z.object({ id: idParam("wave") }), body: WaveEditBody },
  async ({ user, params, body, ip }) => Response.json(await editWaveBy(user, params.id, body, ip)),
);

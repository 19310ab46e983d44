import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { idParam } from "@/lib/http/params";
import { getWave } from "@/db/waves";
import { listBatches } from "@/db/batches";
import { shortPicksOfWave } from "@/db/short-picks";

export const GET = route(
  { access: "waves.read", params: z.object({ id: idParam("wave") }) },
  async ({ user, params }) => {
    const wave = await getWave(user.siteId, params.id);
    if (!wave) throw new HttpError(404, "No such wave at this site.");
    const [batches, shortPicks] = await Promise.all([listBatches(wave.id), shortPicksOfWave(wave.id)]);
    return Response.json({ wave, batches, shortPicks });
  },
);

import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { intParam } from "@/lib/http/params";
import { getWave } from "@/db/waves";
import { listBatches } from "@/db/batches";
import { shortPicksOfWave } from "@/db/short-picks";

export const dynamic = "force-dynamic";

export const GET = route({ access: "waves.read" }, async ({ user, params }) => {
  const wave = await getWave(user.siteId, intParam(params, "id", "wave"));
  if (!wave) throw new HttpError(404, "No such wave at this site.");
  const [batches, shortPicks] = await Promise.all([listBatches(wave.id), shortPicksOfWave(wave.id)]);
  return Response.json({ wave, batches, shortPicks });
});

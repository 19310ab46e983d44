import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { intParam } from "@/lib/http/params";
import { getWave, recordPrinted } from "@/db/waves";
import { audit } from "@/db/audit";

const Printed = z.object({ numbers: z.array(z.number().int().positive().max(10_000, "No wave has that many batches.")).min(1, "Say which batches were printed.").max(2000) });

export const POST = route({ access: "waves.plan", body: Printed }, async ({ user, params, body, ip }) => {
  const wave = await getWave(user.siteId, intParam(params, "id", "wave"));
  if (!wave) throw new HttpError(404, "No such wave at this site.");
  if (wave.status === "draft") throw new HttpError(409, "Plan the wave before printing its pick lists.");
  const before = await recordPrinted(wave.id, body.numbers);
  const reprints = [...before.entries()].filter(([, n]) => n > 0).map(([b]) => b);
  await audit({ event: "batch.printed", actorUserId: user.id, subject: `wave:${wave.id}`, ip, detail: { batches: body.numbers, reprints } });
  return Response.json({ printed: body.numbers.length, reprints });
});

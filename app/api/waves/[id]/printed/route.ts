import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { intParam } from "@/lib/http/params";
import { getWave } from "@/db/waves";
import { recordPrinted } from "@/db/batch-prints";
import { audit } from "@/db/audit";

const Printed = z.object({ numbers: z.array(z.number().int().positive().max(10_000, "No wave has that many batches.")).min(1, "Say which batches were printed.").max(2000) });

const list = (ns: number[]) => (ns.length <= 10 ? ns.join(", ") : `${ns.slice(0, 10).join(", ")} and ${ns.length - 10} more`);

export const POST = route({ access: "waves.plan", body: Printed }, async ({ user, params, body, ip }) => {
  const wave = await getWave(user.siteId, intParam(params, "id", "wave"));
  if (!wave) throw new HttpError(404, "No such wave at this site.");
  if (wave.status === "draft") throw new HttpError(409, "Plan the wave before printing its pick lists.");
  const outcome = await recordPrinted(wave.id, body.numbers);
  if ("unknown" in outcome) {
    const has = outcome.batchCount === 0 ? "it has no batches" : outcome.batchCount === 1 ? "it has batch 1 only" : `it has batches 1–${outcome.batchCount}`;
    throw new HttpError(400, `This wave has no batch ${list(outcome.unknown)} (${has}); nothing was counted as printed. It may have been re-planned: reload the page and print again.`);
  }
  const printed = [...outcome.before.keys()];
  const reprints = printed.filter((n) => (outcome.before.get(n) ?? 0) > 0);
  await audit({ event: "batch.printed", actorUserId: user.id, subject: `wave:${wave.id}`, ip, detail: { batches: printed, reprints } });
  return Response.json({ printed: printed.length, reprints });
});

import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { parseId } from "@/lib/http/params";
import { getSite } from "@/db/sites";
import { openReplenishments, shortPicksOfShift } from "@/db/short-picks";
import { dayOf, dayRange, isDay } from "@/lib/format/day-range";
import type { ShortPicksDTO } from "@/lib/contracts/short-picks";

// ?date=YYYY-MM-DD (the shift's day in the site's time zone; today when absent) and ?waveId=.
export const GET = route({ access: "shortpicks.follow" }, async ({ user, req }) => {
  const search = new URL(req.url).searchParams;
  const site = await getSite(user.siteId);
  const timeZone = site?.timezone ?? "UTC";
  const date = search.get("date") || dayOf(new Date(), timeZone);
  if (!isDay(date)) throw new HttpError(400, "Give the day as a date (YYYY-MM-DD), or leave it empty for today.");
  const rawWave = search.get("waveId");
  const waveId = rawWave ? parseId(rawWave) : undefined;
  if (waveId === null) throw new HttpError(400, "Choose the wave from the list, or show every wave.");
  const [list, replenishments] = await Promise.all([
    shortPicksOfShift(user.siteId, dayRange(date, timeZone), waveId),
    openReplenishments(user.siteId),
  ]);
  return Response.json({ date, ...list, replenishments } satisfies ShortPicksDTO);
});

import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { createWave, listWaves, OrdersTakenError, unclaimedOpenOrderIds } from "@/db/waves";
import { getLayoutVersionById, getLayoutVersion } from "@/db/layout-versions";
import { audit } from "@/db/audit";
import { rowId } from "@/lib/http/body-fields";
import { elementId } from "@/lib/floor-plan/document";

export const dynamic = "force-dynamic";

const NewWave = z.object({
  name: z.string().trim().min(1, "Name the wave, e.g. “Tuesday morning”.").max(120),
  layoutVersionId: rowId("layout version"),
  settings: z.object({
    totesPerCart: z.number().int().min(1, "A cart carries at least one tote.").max(40),
    maxLines: z.number().int().min(1).max(500),
    maxWeightG: z.number().int().min(1000, "Allow at least 1 kg per cart.").max(1_000_000),
    // The editor's ids of the layout version's depot and drop-off.
    depotId: elementId,
    dropoffId: elementId,
    method: z.enum(["first-come", "savings"]),
  }),
  cutoffBefore: z.iso.datetime({ offset: true }).optional(),
  priorities: z.array(z.number().int().min(1).max(3)).max(3).optional(),
});

export const GET = route({ access: "waves.read" }, async ({ user }) => Response.json({ waves: await listWaves(user.siteId) }));

export const POST = route({ access: "waves.plan", body: NewWave }, async ({ user, body, ip }) => {
  const version = await getLayoutVersionById(user.siteId, body.layoutVersionId);
  if (!version) throw new HttpError(404, "No such layout version at this site. Publish the floor plan first.");
  const full = await getLayoutVersion(user.siteId, version.floorPlanId, version.number);
  const depots = full?.document.depots.map((d) => d.id) ?? [];
  const ends = [...depots, ...(full?.document.dropoffs.map((d) => d.id) ?? [])];
  if (!depots.includes(body.settings.depotId)) throw new HttpError(400, `Layout version ${version.number} has no depot ${body.settings.depotId}.`);
  if (!ends.includes(body.settings.dropoffId)) throw new HttpError(400, `Layout version ${version.number} has no drop-off ${body.settings.dropoffId}.`);
  const orderIds = await unclaimedOpenOrderIds(user.siteId, { cutoffBefore: body.cutoffBefore ? new Date(body.cutoffBefore) : undefined, priorities: body.priorities });
  if (orderIds.length === 0) throw new HttpError(422, "No open orders match: every matching order is already in a wave, or none was imported. Widen the cut-off or priorities.");
  try {
    const id = await createWave(user.siteId, { name: body.name, layoutVersionId: version.id, settings: body.settings, orderIds }, user.id);
    await audit({ event: "wave.created", actorUserId: user.id, subject: `wave:${id}`, ip, detail: { orders: orderIds.length } });
    return Response.json({ id, orders: orderIds.length }, { status: 201 });
  } catch (e) {
    if (e instanceof OrdersTakenError) throw new HttpError(409, `Another planner just put some of these orders in a wave (${e.orderNumbers.slice(0, 5).join(", ")}…). Try again to take the rest.`);
    throw e;
  }
});

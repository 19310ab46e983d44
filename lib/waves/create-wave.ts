import "server-only";
import { createWave, OrdersTakenError, unclaimedOpenOrderIds } from "@/db/waves";
import type { WaveSettings } from "@/lib/contracts/waves";
import { getLayoutVersionById, getLayoutVersion } from "@/db/layout-versions";
import { audit } from "@/db/audit";
import type { SignedInUser } from "@/lib/auth/session";
import { HttpError } from "@/lib/http/errors";

export type NewWave = {
  name: string;
  layoutVersionId: number;
  settings: WaveSettings;
  cutoffBefore?: string;
  priorities?: number[];
  includeNoCutoff?: boolean;
};

/**
 * A planner opens a wave on a layout version with every open order that matches the filter and is
 * in no other wave yet; its depot and drop-off must be ones that version has.
 */
export async function openWave(
  user: SignedInUser,
  input: NewWave,
  ip: string,
): Promise<{ id: number; orders: number }> {
  const version = await getLayoutVersionById(user.siteId, input.layoutVersionId);
  if (!version) throw new HttpError(404, "No such layout version at this site. Publish the floor plan first.");
  const full = await getLayoutVersion(user.siteId, version.floorPlanId, version.number);
  const depots = full?.document.depots.map((d) => d.id) ?? [];
  const ends = [...depots, ...(full?.document.dropoffs.map((d) => d.id) ?? [])];
  if (!depots.includes(input.settings.depotId))
    throw new HttpError(400, `Layout version ${version.number} has no depot ${input.settings.depotId}.`);
  if (!ends.includes(input.settings.dropoffId))
    throw new HttpError(400, `Layout version ${version.number} has no drop-off ${input.settings.dropoffId}.`);
  const orderIds = await unclaimedOpenOrderIds(user.siteId, {
    cutoffBefore: input.cutoffBefore ? new Date(input.cutoffBefore) : undefined,
    priorities: input.priorities,
    includeNoCutoff: input.includeNoCutoff,
  });
  if (orderIds.length === 0)
    throw new HttpError(
      422,
      "No open orders match: every matching order is already in a wave, or none was imported. Widen the cut-off or priorities.",
    );
  try {
    const id = await createWave(
      user.siteId,
      { name: input.name, layoutVersionId: version.id, settings: input.settings, orderIds },
      user.id,
    );
    await audit({
      event: "wave.created",
      actorUserId: user.id,
      subject: `wave:${id}`,
      ip,
      detail: { orders: orderIds.length },
    });
    return { id, orders: orderIds.length };
  } catch (e) {
    if (e instanceof OrdersTakenError)
      throw new HttpError(
        409,
        `Another planner just put some of these orders in a wave (${e.orderNumbers.slice(0, 5).join(", ")}…). Try again to take the rest.`,
      );
    throw e;
  }
}

import { z } from "zod";
import { route } from "@/lib/http/route";
import { listWaves } from "@/db/waves";
import { openWave } from "@/lib/waves/create-wave";
import { rowId } from "@/lib/http/body-fields";
import { elementId } from "@/lib/floor-plan/document";

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
  // With a cut-off: also take the open orders that have none.
  includeNoCutoff: z.boolean().optional(),
});

export const GET = route({ access: "waves.read" }, async ({ user }) =>
  Response.json({ waves: await listWaves(user.siteId) }),
);

export const POST = route({ access: "waves.plan", body: NewWave }, async ({ user, body, ip }) =>
  Response.json(await openWave(user, body, ip), { status: 201 }),
);

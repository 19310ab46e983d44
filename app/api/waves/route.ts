import { z } from "zod";
import { route } from "@/lib/http/route";
import { listWaves } from "@/db/waves";
import { openWave } from "@/lib/waves/create-wave";
import { rowId } from "@/lib/http/body-fields";
import { WaveName, WaveSettings } from "@/lib/waves/control-schemas";

const NewWave = z.object({
  name: WaveName,
  layoutVersionId: rowId("layout version"),
  settings: WaveSettings,
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
